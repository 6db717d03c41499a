import { z } from 'zod';

// Request bodies of the Setup API. The client's forms validate with these same schemas, so this
// file imports nothing but zod.

export const motorKinds = ['pmsm', 'induction', 'dc'] as const;
export const windingMaterials = ['copper', 'aluminium'] as const;
export const windingTypes = ['random', 'form'] as const;
/** Thermal classes of IEC 60085 that fit the one-letter column. */
export const insulationClasses = ['A', 'E', 'B', 'F', 'H', 'N', 'R'] as const;
export const subgroupModes = ['individual', 'lot', 'consecutive'] as const;

const reason = z.string().trim().max(1000, 'Keep the reason under 1000 characters').optional();
const upperCode = (max: number) =>
  z.string().trim().min(1, 'Required').max(max, `At most ${max} characters`)
    .regex(/^[A-Z0-9][A-Z0-9-]*$/, 'Capital letters, digits and dashes only');
const isoDate = z.iso.date('Use a date as YYYY-MM-DD');

/**
 * Why the pattern is anchored: a serial must match as a whole, so "^\d{6}" would let "123456-junk"
 * through. A top-level "|" breaks the anchors too ("^A|B$" matches "xB"), hence the depth scan.
 */
export function serialPatternProblem(pattern: string): string | undefined {
  try {
    new RegExp(pattern, 'u');
  } catch (error) {
    return `Not a valid regular expression: ${(error as Error).message}`;
  }
  const endsWithAnchor = pattern.endsWith('$') && !/(^|[^\\])(\\\\)*\\\$$/.test(pattern);
  if (!pattern.startsWith('^') || !endsWithAnchor) return 'Anchor the pattern: start with ^ and end with $';
  let depth = 0;
  let inClass = false;
  for (let i = 0; i < pattern.length; i++) {
    const char = pattern[i];
    if (char === '\\') i++;
    else if (inClass) inClass = char !== ']';
    else if (char === '[') inClass = true;
    else if (char === '(') depth++;
    else if (char === ')') depth--;
    else if (char === '|' && depth === 0) return 'Wrap alternatives in a group, e.g. ^(?:A|B)$, so both anchors apply';
  }
  return undefined;
}

const productFields = z.object({
  name: z.string().trim().min(1, 'Required').max(200, 'At most 200 characters'),
  motorKind: z.enum(motorKinds),
  polePairs: z.int('Whole number of pole pairs').min(1, 'At least 1').max(64, 'At most 64'),
  resolverPolePairs: z.int('Whole number of pole pairs').min(1, 'At least 1').max(32, 'At most 32').nullable(),
  ratedVoltageV: z.number().positive('Must be above 0').max(15000, 'At most 15 000 V'),
  ratedPowerKw: z.number().positive('Must be above 0').lt(10000, 'Below 10 000 kW'),
  ratedSpeedRpm: z.number().positive('Must be above 0').max(100000, 'At most 100 000 rpm'),
  windingMaterial: z.enum(windingMaterials),
  windingType: z.enum(windingTypes),
  insulationClass: z.enum(insulationClasses),
  serialPattern: z.string().min(1, 'Required').max(200, 'At most 200 characters'),
  reason,
});

type ProductRules = Pick<z.infer<typeof productFields>, 'motorKind' | 'polePairs' | 'resolverPolePairs' | 'serialPattern'>;

function checkProductRules(product: ProductRules, ctx: z.RefinementCtx) {
  const patternProblem = serialPatternProblem(product.serialPattern);
  if (patternProblem) ctx.addIssue({ code: 'custom', path: ['serialPattern'], message: patternProblem });
  if (product.motorKind !== 'pmsm' && product.resolverPolePairs !== null) {
    ctx.addIssue({ code: 'custom', path: ['resolverPolePairs'], message: 'Only PMSM products carry a resolver; leave it empty' });
  }
  if (product.motorKind === 'pmsm') {
    if (product.resolverPolePairs === null) {
      ctx.addIssue({ code: 'custom', path: ['resolverPolePairs'], message: 'Required for a PMSM (the resolver offset needs it)' });
    } else if (product.polePairs % product.resolverPolePairs !== 0) {
      ctx.addIssue({ code: 'custom', path: ['resolverPolePairs'], message: 'Motor pole pairs must be a whole multiple of the resolver pole pairs' });
    }
  }
}

export const productCreateSchema = productFields.extend({ code: upperCode(32) }).superRefine(checkProductRules);
/** The code is the product's identity on every serial, so an edit replaces everything else. */
export const productUpdateSchema = productFields.superRefine(checkProductRules);
export type ProductCreateInput = z.infer<typeof productCreateSchema>;
export type ProductUpdateInput = z.infer<typeof productUpdateSchema>;

const characteristicFields = z.object({
  name: z.string().trim().min(1, 'Required').max(200, 'At most 200 characters'),
  unit: z.string().trim().min(1, 'Required (use 1 for a ratio)').max(32, 'At most 32 characters'),
  testStep: z.string().trim().min(1, 'Required').max(64, 'At most 64 characters'),
  spcEnabled: z.boolean(),
  subgroupMode: z.enum(subgroupModes),
  subgroupSize: z.int('Whole number').min(2, 'At least 2').max(25, 'At most 25').nullable(),
  sortOrder: z.int('Whole number').min(0).max(9999).default(0),
  reason,
});

function checkSubgroup(value: { subgroupMode: string; subgroupSize: number | null }, ctx: z.RefinementCtx) {
  if (value.subgroupMode === 'consecutive' && value.subgroupSize === null) {
    ctx.addIssue({ code: 'custom', path: ['subgroupSize'], message: 'Consecutive subgroups need a size' });
  }
  if (value.subgroupMode === 'individual' && value.subgroupSize !== null) {
    ctx.addIssue({ code: 'custom', path: ['subgroupSize'], message: 'Individual values have no subgroup size; leave it empty' });
  }
}

export const characteristicCreateSchema = characteristicFields.extend({
  code: z.string().trim().min(1, 'Required').max(64, 'At most 64 characters')
    .regex(/^[a-z0-9][a-z0-9_.-]*$/, 'Small letters, digits, dots, dashes and underscores only'),
}).superRefine(checkSubgroup);
export const characteristicUpdateSchema = characteristicFields.superRefine(checkSubgroup);
export type CharacteristicCreateInput = z.infer<typeof characteristicCreateSchema>;
export type CharacteristicUpdateInput = z.infer<typeof characteristicUpdateSchema>;

const bound = z.number('A number, or empty').nullable();

export const limitRowSchema = z.object({
  characteristicCode: z.string().min(1, 'Required'),
  lsl: bound,
  nominal: bound,
  usl: bound,
}).superRefine((row, ctx) => {
  if (row.lsl === null && row.usl === null) {
    ctx.addIssue({ code: 'custom', path: ['usl'], message: 'Give an LSL, a USL or both' });
  }
  if (row.lsl !== null && row.nominal !== null && row.nominal < row.lsl) {
    ctx.addIssue({ code: 'custom', path: ['nominal'], message: 'Nominal must not be below the LSL' });
  }
  if (row.usl !== null && row.nominal !== null && row.nominal > row.usl) {
    ctx.addIssue({ code: 'custom', path: ['usl'], message: 'USL must not be below the nominal' });
  } else if (row.usl !== null && row.lsl !== null && row.lsl > row.usl) {
    ctx.addIssue({ code: 'custom', path: ['usl'], message: 'USL must not be below the LSL' });
  }
});

export const draftLimitsSchema = z.object({
  limits: z.array(limitRowSchema).max(500, 'At most 500 limits per revision'),
  note: z.string().trim().max(1000, 'At most 1000 characters').nullable().optional(),
  reason,
}).superRefine((body, ctx) => {
  const seen = new Set<string>();
  body.limits.forEach((row, i) => {
    if (seen.has(row.characteristicCode)) {
      ctx.addIssue({ code: 'custom', path: ['limits', i, 'characteristicCode'], message: 'Listed twice' });
    }
    seen.add(row.characteristicCode);
  });
});
export type DraftLimitsInput = z.infer<typeof draftLimitsSchema>;
export type LimitRowInput = z.infer<typeof limitRowSchema>;

export const draftCreateSchema = z.object({
  basis: z.enum(['in-force', 'empty']),
  note: z.string().trim().max(1000, 'At most 1000 characters').nullable().optional(),
  reason,
});
export const approveSchema = z.object({
  effectiveFrom: z.iso.datetime({ offset: true, message: 'Use an ISO date-time, e.g. 2026-12-02T06:00:00Z' }),
  reason,
});
export const retireSchema = z.object({
  retiredFrom: z.iso.datetime({ offset: true, message: 'Use an ISO date-time' }).optional(),
  reason: z.string().trim().min(3, 'Say why the revision is retired').max(1000, 'At most 1000 characters'),
});
export const discardSchema = z.object({ reason });
export type DraftCreateInput = z.infer<typeof draftCreateSchema>;
export type ApproveInput = z.infer<typeof approveSchema>;
export type RetireInput = z.infer<typeof retireSchema>;

const stationFields = z.object({
  name: z.string().trim().min(1, 'Required').max(200, 'At most 200 characters'),
  line: z.string().trim().min(1, 'Required').max(32, 'At most 32 characters'),
  kind: z.string().trim().min(1, 'Required').max(64, 'At most 64 characters'),
  active: z.boolean(),
  reason,
});
export const stationCreateSchema = stationFields.extend({ code: upperCode(32), calibrationDue: isoDate });
/**
 * The code is the station's identity on every run, so an edit replaces everything else. Moving
 * the due date here (a correction, or a stand taken out of use) needs a reason, checked by the
 * service against the stored date; a new calibration is recorded with its certificate instead.
 */
export const stationUpdateSchema = stationFields.extend({ calibrationDue: isoDate });
export type StationCreateInput = z.infer<typeof stationCreateSchema>;
export type StationUpdateInput = z.infer<typeof stationUpdateSchema>;

export const calibrationSchema = z.object({
  calibratedOn: isoDate,
  due: isoDate,
  certificate: z.string().trim().max(200, 'At most 200 characters').nullable(),
  reason,
}).refine((value) => value.due > value.calibratedOn, { path: ['due'], message: 'Due date must be after the calibration date' });
export type CalibrationInput = z.infer<typeof calibrationSchema>;

export const stationClientSchema = z.object({
  clientId: z.string().trim().min(1, 'Required').max(128, 'At most 128 characters')
    .regex(/^[A-Za-z0-9._:-]+$/, 'Letters, digits, dots, colons, dashes and underscores only'),
  stationCode: z.string().trim().min(1, 'Required'),
  reason,
});
export type StationClientInput = z.infer<typeof stationClientSchema>;
