import type { ComponentType } from 'react';
import type { Action, Role } from '../lib/permissions';
import { paths } from '../lib/paths';

type ScreenModule = { default: ComponentType };

export type Screen = {
  title: string;
  path: string;
  action: Action;
  /** Only list screens appear in the navigation; record screens are reached from them. */
  inNav: boolean;
  load: () => Promise<ScreenModule>;
};

function screen(title: string, path: string, action: Action, load: Screen['load'], inNav = true): Screen {
  return { title, path, action, inNav, load };
}

export const screens = {
  scan: screen('Scan', paths.scan.path, 'scan:use', () => import('../routes/scan')),
  motors: screen('Motors', paths.motors.path, 'motors:read', () => import('../routes/motors')),
  motorRecord: screen('Motor record', paths.motorRecord.path, 'motors:read', () => import('../routes/motor-record'), false),
  lots: screen('Lots', paths.lots.path, 'lots:read', () => import('../routes/lots')),
  lot: screen('Lot', paths.lot.path, 'lots:read', () => import('../routes/lot'), false),
  controlCharts: screen('Control charts', paths.controlCharts.path, 'spc:read', () => import('../routes/control-charts')),
  signals: screen('Signals', paths.signals.path, 'signals:read', () => import('../routes/signals')),
  signal: screen('Signal', paths.signal.path, 'signals:read', () => import('../routes/signal'), false),
  evidencePacks: screen('Evidence packs', paths.evidencePacks.path, 'evidence:read', () => import('../routes/evidence-packs')),
  auditTrail: screen('Audit trail', paths.auditTrail.path, 'audit:read', () => import('../routes/audit-trail')),
  yieldBoard: screen('Yield board', paths.yieldBoard.path, 'yield:read', () => import('../routes/yield-board')),
  setup: screen('Setup', paths.setup.path, 'setup:read', () => import('../routes/setup')),
} satisfies Record<string, Screen>;

export type ScreenKey = keyof typeof screens;

export const navScreens: Screen[] = Object.values(screens).filter((screen) => screen.inNav);

/** Where each role lands at "/": its main job, per DESIGN.md "Who uses it". */
export const landingScreenByRole: Record<Role, ScreenKey> = {
  operator: 'scan',
  quality: 'signals',
  auditor: 'evidencePacks',
  manager: 'yieldBoard',
  admin: 'setup',
};
