export const LINES = ['uv', 'vw', 'wu'] as const;
export type Line = (typeof LINES)[number];

export const LINE_LABELS: Record<Line, string> = { uv: 'U–V', vw: 'V–W', wu: 'W–U' };

// Three phases told apart by hue and lightness, none of them a verdict colour.
export const LINE_COLOURS: Record<Line, string> = { uv: '#b8733a', vw: '#2d3338', wu: '#4f7a94' };
