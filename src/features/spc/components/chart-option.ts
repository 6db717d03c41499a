import type { ChartData, Limits } from '../api/spc-schemas';
import type { SpcChartOption } from './ControlChart';

const ink = { value: '#3b4350', faint: '#a3a9b2', ewma: '#b8733a', limit: '#b5512a', centre: '#2f7d4f', spec: '#6b4e00', mark: '#c42b2f' };

type Line = { name: string; yAxis: number; color: string; dashed?: boolean };

function limitLines(limits: Limits | null, spec: ChartData['spec'], showSpec: boolean): Line[] {
  const lines: Line[] = [];
  if (limits && limits.chartKind !== 'cusum') {
    const tag = limits.status === 'frozen' ? '' : ' (trial)';
    lines.push({ name: `UCL${tag}`, yAxis: limits.ucl, color: ink.limit }, { name: `Centre${tag}`, yAxis: limits.centre, color: ink.centre }, { name: `LCL${tag}`, yAxis: limits.lcl, color: ink.limit });
  }
  if (showSpec && spec) {
    if (spec.usl !== null) lines.push({ name: 'USL', yAxis: spec.usl, color: ink.spec, dashed: true });
    if (spec.lsl !== null) lines.push({ name: 'LSL', yAxis: spec.lsl, color: ink.spec, dashed: true });
  }
  return lines;
}

/**
 * The individuals view of a characteristic: every value, or for long series each older bucket's
 * min and max (so no spike is hidden) followed by the recent values one by one; the limits in
 * force, optional spec limits, rule marks on the exact values and the signals Phase II raised.
 */
export function controlChartOption(data: ChartData, showSpec: boolean): SpcChartOption {
  const limits = data.limits.frozen ?? data.limits.trial;
  const series: Array<[number, number]> = [
    ...data.buckets.flatMap((b) => [[b.fromRunId, b.min], [b.toRunId, b.max]] as Array<[number, number]>),
    ...data.points.map((p): [number, number] => [p.runId, p.value]),
  ];
  // On an EWMA chart the limits bound the smoothed statistic, so the raw values recede behind it.
  const smoothed = data.ewma.length > 0;
  const valueColour = smoothed ? ink.faint : ink.value;
  return {
    animation: false,
    grid: { left: 64, right: 96, top: 24, bottom: 64 },
    tooltip: { trigger: 'axis' },
    xAxis: { type: 'value', name: 'run', min: 'dataMin', max: 'dataMax' },
    yAxis: { type: 'value', name: data.characteristic.unit, scale: true },
    dataZoom: [{ type: 'inside' }, { type: 'slider', height: 20, bottom: 16 }],
    series: [
      {
        type: 'line', name: data.characteristic.name, data: series, showSymbol: !data.sampled, symbolSize: 4,
        lineStyle: { color: valueColour, width: 1 }, itemStyle: { color: valueColour },
        markLine: {
          symbol: 'none', silent: true,
          data: limitLines(limits, data.spec, showSpec).map((l) => ({
            name: l.name, yAxis: l.yAxis, label: { formatter: l.name, position: 'end' }, lineStyle: { color: l.color, type: l.dashed ? 'dashed' : 'solid' },
          })),
        },
      },
      ...(smoothed ? [{
        type: 'line' as const, name: 'EWMA statistic', data: data.ewma.map((p): [number, number] => [p.runId, p.z]),
        showSymbol: false, lineStyle: { color: ink.ewma, width: 2 }, itemStyle: { color: ink.ewma },
      }] : []),
      {
        type: 'scatter', name: 'Rule broken', symbol: 'diamond', symbolSize: 11, itemStyle: { color: ink.mark },
        data: data.violations.map((v) => ({ value: [v.runId, v.value], name: `${v.rule}: ${v.ruleText}` })),
        tooltip: { formatter: (p: unknown) => (p as { name: string }).name },
      },
      {
        type: 'scatter', name: 'Signal raised', symbol: 'triangle', symbolSize: 10, itemStyle: { color: ink.limit },
        data: data.signals.filter((s) => s.value !== null).map((s) => ({ value: [s.runId, s.value], name: `Signal ${s.id} (${s.status}): ${s.ruleText}` })),
        tooltip: { formatter: (p: unknown) => (p as { name: string }).name },
      },
    ],
  };
}
