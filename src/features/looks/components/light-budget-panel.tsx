import { Card } from '../../../components/ui/card';
import { ErrorMessage, Spinner } from '../../../components/ui/alert';
import { LightBudgetChart } from '../../../components/ui/light-budget-chart';
import type { LightBudgetAnswer } from '../../../../shared/schemas/look';
import { relativeLightPhrase } from '../../../../shared/tone/light-budget';
import { useLightBudget } from '../api/get-light-budget';

/** "needs 4.6× the light of *Panchromatic, no filter*" (the reference in italics); the reference itself says so. */
export function RelativeLightLine({ budget, lookId, className = '' }: { budget: LightBudgetAnswer; lookId: number; className?: string }) {
  const ref = budget.looks[0];
  const row = budget.looks.find((l) => l.lookId === lookId);
  if (!row) return null;
  const cls = `text-sm ${className}`;
  if (row.lookId === ref.lookId) return <p className={`${cls} text-ink-soft`} data-testid="relative-light">The reference of the light budget.</p>;
  if (row.relative === null) return <p className={`${cls} text-ink-mute`} data-testid="relative-light">No exposure index (the eye): not in the light budget.</p>;
  const phrase = relativeLightPhrase(row.relative);
  return (
    <p className={`${cls} font-semibold`} data-testid="relative-light">
      {phrase.charAt(0).toUpperCase() + phrase.slice(1)} <em className="font-semibold">{ref.name}</em>.
    </p>
  );
}

/**
 * The light budget of some looks (the first is the reference) on a card: the bar chart and, for the look
 * that costs the most, the sentence a producer repeats.
 */
export function LightBudgetPanel({ pid, lookIds, highlightId, title = 'Light budget' }: { pid: number; lookIds: number[]; highlightId?: number; title?: string }) {
  const q = useLightBudget(pid, { lookIds });
  const b = q.data;
  const dearest = b?.looks.slice(1).reduce<LightBudgetAnswer['looks'][number] | null>((m, l) => (l.relative !== null && (!m || l.relative > m.relative!) ? l : m), null);
  return (
    <Card className="mb-4" aria-label={title}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2>{title}</h2>
        {b && dearest && (
          <p className="text-sm text-ink-soft"><span className="font-semibold text-ink">{dearest.name}</span> {relativeLightPhrase(dearest.relative!)} <em>{b.looks[0].name}</em>.</p>
        )}
      </div>
      <ErrorMessage error={q.error} />
      {q.isPending && lookIds.length > 0 && <Spinner label="Working out the light…" />}
      {b && <LightBudgetChart budget={b} highlightId={highlightId} />}
    </Card>
  );
}
