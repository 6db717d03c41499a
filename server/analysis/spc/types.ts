/** Centre line and 3-sigma control limits of one chart. */
export interface ControlLimits {
  center: number;
  ucl: number;
  lcl: number;
}

/** Control limits of one subgroup when subgroup sizes differ (the centre line is shared). */
export interface SubgroupMeanLimits {
  ucl: number;
  lcl: number;
}
