import { LightBudgetChart } from '../../../components/ui/light-budget-chart';
import type { ExposureSheet } from '../../../../shared/schemas/sheet';
import { relativeLightPhrase } from '../../../../shared/tone/light-budget';
import { useSheetLightBudget } from '../api/get-sheet-light-budget';

/**
 * The sheet's light budget: this look against the production's other looks (the first look is the
 * reference), this look's bar in the accent colour, at this sheet's camera. Nothing for a look without an
 * exposure index or a production with one look.
 */
export function SheetLightBudget({ s }: { s: ExposureSheet }) {
  const camera = { tStop: s.camera.tStop, fps: s.camera.fps, shutterAngle: s.camera.shutterAngle };
  const q = useSheetLightBudget(s.production.id, s.look.id, camera);
  const b = q.data;
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
