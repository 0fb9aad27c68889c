import { LightBudgetChart } from '../../../components/ui/light-budget-chart';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { relativeLightPhrase } from '../../../../shared/tone/light-budget';

/**
 * The sheet's light budget: this look against the production's other looks (the first look is the
 * reference), this look's bar in the accent colour, at this sheet's camera — as the sheet's answer carries
 * it (the server's LooksService.sheetLightBudget, the same the PDF draws). Nothing for a look without an
 * exposure index or a production with one look.
 */
export function SheetLightBudget({ s }: { s: ExposureSheet }) {
  const b = s.lightBudget;
  if (!s.chain || !b || b.looks.length < 2) return null;
  const ref = b.looks[0];
  const mine = b.looks.find((l) => l.lookId === s.look.id);
  return (
    <section className="mb-5 break-inside-avoid" data-testid="sheet-light-budget">
      <h2 className="mb-2 text-[11px] font-semibold uppercase tracking-widest text-accent">Light budget between looks</h2>
      {mine && mine.relative !== null && (
        <p className="mb-2 text-sm font-semibold">
          {mine.lookId === ref.lookId ? 'This look is the reference of the production’s light budget.' : <>This look {relativeLightPhrase(mine.relative)} <em>{ref.name}</em>.</>}
        </p>
      )}
      <LightBudgetChart budget={b} highlightId={s.look.id} />
    </section>
  );
}
