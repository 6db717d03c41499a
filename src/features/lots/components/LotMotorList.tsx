import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/Button';
import { MotorStatusBadge } from '../../../components/MotorStatusBadge';
import { formatCount, formatDateTime } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { LotMotor } from '../api/lot-schemas';

// A lot can hold thousands of motors; draw the first few and the rest on request.
const firstShown = 50;

const attentionRank: Record<LotMotor['status'], number> = { failed: 0, 'on hold': 1, 'not tested': 2, passed: 3 };

/** The lot's motors, the ones that need someone first (failed, on hold, not tested), then by serial. */
export function LotMotorList({ motors }: { motors: LotMotor[] }) {
  const [showAll, setShowAll] = useState(false);
  if (motors.length === 0) return <p className="text-sm text-graphite-500">No motors in this lot yet.</p>;
  const ordered = [...motors].sort((a, b) => attentionRank[a.status] - attentionRank[b.status] || a.serial.localeCompare(b.serial));
  const shown = showAll ? ordered : ordered.slice(0, firstShown);
  return (
    <div className="space-y-2">
      <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
        <table aria-label="Motors in this lot" className="w-full text-sm">
          <caption className="px-4 py-2 text-left text-xs text-graphite-500">Failed, held and untested motors first, then by serial.</caption>
          <thead className="bg-paper-200 text-left text-xs uppercase tracking-wider text-graphite-600">
            <tr>
              <th scope="col" className="px-4 py-2 font-medium">Serial</th>
              <th scope="col" className="px-4 py-2 font-medium">Status</th>
              <th scope="col" className="px-4 py-2 text-right font-medium">Attempts</th>
              <th scope="col" className="px-4 py-2 font-medium">Last tested</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-200">
            {shown.map((motor) => (
              <tr key={motor.serial}>
                <td className="px-4 py-1.5">
                  <Link to={paths.motorRecord.href(motor.serial)} className="figures font-medium text-copper-700 hover:underline">
                    {motor.serial}
                  </Link>
                </td>
                <td className="px-4 py-1.5">
                  <MotorStatusBadge status={motor.status} />
                </td>
                <td className="figures px-4 py-1.5 text-right">{motor.attempts}</td>
                <td className="figures px-4 py-1.5 text-graphite-600">{formatDateTime(motor.lastTestedAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {shown.length < motors.length ? (
        <Button variant="secondary" onClick={() => setShowAll(true)}>
          Show all {formatCount(motors.length)} motors
        </Button>
      ) : null}
    </div>
  );
}
