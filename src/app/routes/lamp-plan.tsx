import { useEffect, useMemo, useRef, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { Card, PageHeader } from '../../components/ui/card';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { usePlanLooks, usePlanSheet } from '../../features/lighting/api/get-plan-looks';
import { useLightPlan } from '../../features/lighting/api/post-light-plan';
import { PlanSetup } from '../../features/lighting/components/plan-setup';
import { LampTable } from '../../features/lighting/components/lamp-table';
import { PlanNotes, PlanReadout } from '../../features/lighting/components/plan-readout';
import { useDebounced } from '../../lib/use-debounced';
import { checkDraft, initialDraft, newLamp, type CameraField, type LampDraft, type PlanDraft } from '../../features/lighting/lib/plan-draft';
import { MAX_PLAN_LAMPS } from '../../../shared/schemas/light-plan';

/**
 * The gaffer's lamp plan: a look's effective EI (or a typed one) and camera give the level needed; lamps
 * placed by distance give what each contributes, the total against the need, and the key-to-fill ratio
 * against the medium's shadow-detail threshold.
 */
export default function LampPlanPage() {
  const pid = Number(useParams().productionId);
  const [search, setSearch] = useSearchParams();
  const looks = usePlanLooks(pid);
  const lookParam = search.get('look');
  const lookId = lookParam === 'none' ? null : lookParam ? Number(lookParam) : (looks.data?.looks[0]?.id ?? null);
  const sheet = usePlanSheet(pid, lookId);
  const [draft, setDraft] = useState<PlanDraft>(initialDraft);

  // a chosen look's EI, camera and threshold fill the fields once it is worked out
  const applied = useRef<string>('');
  const s = sheet.data?.sheet;
  useEffect(() => {
    if (!s || s.look.id !== lookId) return;
    const stamp = `${s.look.id}@${s.look.updatedAt}`;
    if (applied.current === stamp) return;
    applied.current = stamp;
    setDraft((d) => ({
      ...d,
      ei: s.chain ? String(s.chain.effectiveEI) : d.ei,
      tStop: String(s.camera.tStop),
      fps: String(s.camera.fps),
      shutterAngle: String(s.camera.shutterAngle),
      meterConstant: String(s.camera.calibrationConstant),
      shadowDetailStops: String(s.thresholds.shadowDetailStops),
    }));
  }, [s, lookId]);

  const checked = useMemo(() => checkDraft(draft), [draft]);
  const settled = useDebounced(checked.request, 250);
  const plan = useLightPlan(settled);
  const answer = plan.data;
  const rowsMatch = !!answer && checked.request !== null && answer.lamps.length === draft.lamps.length;

  const setField = (field: CameraField, value: string) => setDraft((d) => ({ ...d, [field]: value }));
  const changeLamp = (id: number, patch: Partial<LampDraft>) => setDraft((d) => ({ ...d, lamps: d.lamps.map((l) => (l.id === id ? { ...l, ...patch } : l)) }));
  const setRole = (id: number, role: 'key' | 'fill') =>
    setDraft((d) => (role === 'key' ? { ...d, keyId: id, fillId: d.fillId === id ? null : d.fillId } : { ...d, fillId: id, keyId: d.keyId === id ? null : d.keyId }));
  const removeLamp = (id: number) =>
    setDraft((d) => ({ ...d, lamps: d.lamps.filter((l) => l.id !== id), keyId: d.keyId === id ? null : d.keyId, fillId: d.fillId === id ? null : d.fillId }));
  const addLamp = () => setDraft((d) => ({ ...d, lamps: [...d.lamps, newLamp({ name: `Lamp ${d.lamps.length + 1}`, distanceM: '4' })] }));
  const chooseLook = (id: number | null) => {
    applied.current = '';
    setSearch((q) => {
      q.set('look', id === null ? 'none' : String(id));
      return q;
    }, { replace: true });
  };

  return (
    <>
      <PageHeader
        title="Lamp plan"
        subtitle="Lamps by intensity and distance against the light the look needs; key-to-fill against the medium’s shadow detail. Planning figures: meter the set."
      />
      <div className="grid grid-cols-[17rem_1fr] gap-4">
        <Card className="self-start">
          {looks.isPending ? <Spinner /> : (
            <PlanSetup
              looks={looks.data?.looks ?? []}
              lookId={lookId}
              onLook={chooseLook}
              sheet={s && s.look.id === lookId ? s : undefined}
              sheetLoading={sheet.isFetching}
              draft={draft}
              errors={checked.errors}
              onField={setField}
            />
          )}
          <ErrorMessage error={looks.error ?? sheet.error} />
        </Card>
        <div className="flex min-w-0 flex-col gap-4">
          {answer ? <PlanReadout plan={answer} stale={!rowsMatch || plan.isPlaceholderData} /> : plan.isFetching || checked.request ? <Spinner label="Working out the plan…" /> : null}
          {checked.request === null && <p className="text-sm text-warn" role="status">Fix the marked fields; any figures shown are from the last complete plan.</p>}
          <ErrorMessage error={plan.error} />
          <Card>
            <LampTable
              lamps={draft.lamps}
              results={rowsMatch ? answer.lamps : null}
              keyId={draft.keyId}
              fillId={draft.fillId}
              errors={checked.errors}
              onChange={changeLamp}
              onRole={setRole}
              onRemove={removeLamp}
              onAdd={addLamp}
              maxLamps={MAX_PLAN_LAMPS}
            />
          </Card>
          {answer && <PlanNotes plan={answer} />}
        </div>
      </div>
    </>
  );
}
