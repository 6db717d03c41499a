/** The two lines' end-of-line stands, their calibration history and the API clients bound to them. */
export type DemoStation = {
  code: string; line: 'A' | 'B'; name: string;
  /** Days ago of each calibration, oldest first; each is due again `intervalDays` later. */
  calibratedDaysAgo: number[];
};

/** Half-yearly calibration, the plant's interval for EOL stands. */
export const calibrationIntervalDays = 182;

export const demoStations: readonly DemoStation[] = [
  { code: 'EOL-A1', line: 'A', name: 'End-of-line stand A1', calibratedDaysAgo: [252, 70] },
  { code: 'EOL-A2', line: 'A', name: 'End-of-line stand A2', calibratedDaysAgo: [217, 35] },
  { code: 'EOL-B1', line: 'B', name: 'End-of-line stand B1', calibratedDaysAgo: [302, 120] },
  // Overdue: due 182 days after its last calibration, i.e. five days ago. Its recent runs are held.
  { code: 'EOL-B2', line: 'B', name: 'End-of-line stand B2', calibratedDaysAgo: [369, 187] },
];

export const overdueStationCode = 'EOL-B2';

/** Days ago the overdue station's calibration fell due. */
export const overdueSinceDaysAgo = 187 - calibrationIntervalDays;

export const demoStationClients: ReadonlyArray<{ clientId: string; stationCode: string }> = [
  { clientId: 'demo-station', stationCode: 'EOL-A1' },
  { clientId: 'demo-station-b', stationCode: 'EOL-B1' },
  { clientId: 'short-lived-station', stationCode: 'EOL-A2' },
];
