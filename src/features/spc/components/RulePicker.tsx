import { ErrorNote } from '../../../components/ErrorNote';
import { Spinner } from '../../../components/Spinner';
import { useRuleChoices } from '../api/get-rules';

/**
 * The Nelson run rules to judge a characteristic by once its trial limits are frozen, each with
 * the server's own wording. Nothing ticked means the server's defaults, which start ticked.
 */
export function RulePicker({ chosen, onChange }: { chosen: string[] | null; onChange: (next: string[]) => void }) {
  const { data, error, isPending } = useRuleChoices();
  if (isPending) return <Spinner label="Loading the run rules…" />;
  if (error) return <ErrorNote error={error} title="Could not load the run rules" />;
  const nelson = data.rules.filter((r) => r.family === 'nelson');
  const ticked = chosen ?? nelson.filter((r) => r.isDefault).map((r) => r.rule);
  const toggle = (rule: string, on: boolean) => onChange(on ? [...ticked, rule] : ticked.filter((r) => r !== rule));
  return (
    <fieldset className="text-sm">
      <legend className="font-medium">Run rules for these limits</legend>
      <ul className="mt-1 space-y-1">
        {nelson.map((r) => (
          <li key={r.rule}>
            <label className="flex items-start gap-2">
              <input type="checkbox" className="mt-1" checked={ticked.includes(r.rule)} onChange={(e) => toggle(r.rule, e.target.checked)} />
              <span><span className="font-medium">{r.rule.replace('nelson-', 'Nelson ')}</span>: {r.text}</span>
            </label>
          </li>
        ))}
      </ul>
      {ticked.length === 0 ? <p role="note" className="mt-1 text-graphite-500">No rule ticked: the defaults apply.</p> : null}
    </fieldset>
  );
}
