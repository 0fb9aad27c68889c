import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { PageHeader, Card } from '../../components/ui/card';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Notice, Spinner } from '../../components/ui/alert';
import { useMember } from '../../features/productions/hooks/use-member';
import { useLibrary, type LibraryItemView } from '../../features/library/api/get-library';
import { useCurves } from '../../features/library/api/get-curves';
import { useCreateCurve } from '../../features/library/api/create-curve';
import { useDeleteCurve } from '../../features/library/api/delete-curve';
import { CurveChart } from '../../features/library/components/curve-chart';
import { CurveUploadForm } from '../../features/library/components/curve-upload-form';
import { ParametricFilterForm } from '../../features/library/components/parametric-filter-form';
import { GelLightForm } from '../../features/library/components/gel-light-form';
import { roleAtLeast } from '../../../shared/policy/department';
import type { CurveKind, CurveView } from '../../../shared/schemas/curve';
import type { CurveCreateInput } from '../../../shared/schemas/curve';
import { GRID_NM_LIST } from '../../../shared/spectral/grid';

const KINDS: { kind: CurveKind; title: string; unit: string }[] = [
  { kind: 'light', title: 'Lights', unit: 'relative power' },
  { kind: 'filter', title: 'Filters', unit: 'transmittance' },
  { kind: 'medium', title: 'Media', unit: 'relative sensitivity' },
];
type Selected = { type: 'builtin'; item: LibraryItemView } | { type: 'curve'; curve: CurveView } | null;
type AddMode = 'table' | 'parametric' | 'gel';

export default function LibraryPage() {
  const pid = Number(useParams().productionId);
  const { member } = useMember(pid);
  const canEdit = !!member && roleAtLeast(member.role, 'editor');
  const library = useLibrary();
  const curves = useCurves(pid);
  const create = useCreateCurve(pid);
  const remove = useDeleteCurve(pid);
  const [selected, setSelected] = useState<Selected>(null);
  const [mode, setMode] = useState<AddMode>('table');
  const [saved, setSaved] = useState<string | null>(null);

  const submit = (input: CurveCreateInput, reset: () => void) =>
    create.mutate({ pid, ...input }, { onSuccess: (r) => { reset(); setSaved(r.curve.name); setSelected({ type: 'curve', curve: r.curve }); } });
  const pick = (kind: CurveKind) => [
    ...(library.data?.items ?? []).filter((i) => i.kind === kind).map((i) => ({ value: `lib:${i.id}`, label: i.name, values: i.values })),
    ...(curves.data?.curves ?? []).filter((c) => c.kind === kind).map((c) => ({ value: `curve:${c.id}`, label: `${c.name} (this production)`, values: c.samples.map((p) => p[1]) })),
  ];
  const sel = selected;
  const selKind = sel?.type === 'builtin' ? sel.item.kind : sel?.curve.kind;

  return (
    <>
      <PageHeader title="Library" subtitle="Lights, filters and media: the built-in generic models, and this production's own curves. Every curve says where it came from." />
      {(library.isPending || curves.isPending) && <Spinner />}
      <ErrorMessage error={library.error ?? curves.error ?? remove.error} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,4fr)]">
        <div className="grid content-start gap-4">
          {KINDS.map(({ kind, title }) => (
            <Card key={kind} className="p-0">
              <h2 className="border-b border-paper-line px-4 py-2 text-base">{title}</h2>
              <ul className="divide-y divide-paper-line text-sm">
                {(library.data?.items ?? []).filter((i) => i.kind === kind).map((i) => (
                  <li key={i.id}>
                    <button type="button" className={`w-full px-4 py-1.5 text-left hover:bg-paper-sunk ${sel?.type === 'builtin' && sel.item.id === i.id ? 'bg-accent-soft' : ''}`} onClick={() => setSelected({ type: 'builtin', item: i })}>
                      <span className="font-medium">{i.name}</span> <span className="text-xs text-ink-mute">built-in</span>
                    </button>
                  </li>
                ))}
                {(curves.data?.curves ?? []).filter((c) => c.kind === kind).map((c) => (
                  <li key={c.id} className="flex items-center">
                    <button type="button" className={`min-w-0 flex-1 px-4 py-1.5 text-left hover:bg-paper-sunk ${sel?.type === 'curve' && sel.curve.id === c.id ? 'bg-accent-soft' : ''}`} onClick={() => setSelected({ type: 'curve', curve: c })}>
                      <span className="font-medium">{c.name}</span> <span className="text-xs text-accent">this production</span>
                    </button>
                    {canEdit && <Button variant="ghost" aria-label={`Delete ${c.name}`} onClick={() => confirm(`Delete "${c.name}" from the library?`) && remove.mutate({ pid, id: c.id }, { onSuccess: () => setSelected(null) })}>✕</Button>}
                  </li>
                ))}
              </ul>
            </Card>
          ))}
        </div>
        <div className="grid content-start gap-4">
          <Card aria-live="polite">
            {!sel && <p className="text-sm text-ink-mute">Choose a curve to see it and where it came from.</p>}
            {sel && (
              <>
                <h2>{sel.type === 'builtin' ? sel.item.name : sel.curve.name}</h2>
                <p className="mt-1 text-sm text-ink-soft">{sel.type === 'builtin' ? sel.item.description : sel.curve.notes}</p>
                <CurveChart
                  series={[{ label: sel.type === 'builtin' ? sel.item.name : sel.curve.name, pairs: sel.type === 'builtin' ? GRID_NM_LIST.map((nm, i) => [nm, sel.item.values[i]]) : sel.curve.samples }]}
                  yLabel={KINDS.find((k) => k.kind === selKind)!.unit} yMax={selKind === 'filter' ? 1 : undefined} />
                <dl className="mt-2 grid gap-1 text-xs">
                  <div><dt className="inline font-medium">Where it came from: </dt><dd className="inline text-ink-soft">{sel.type === 'builtin' ? `${sel.item.note}${sel.item.generic ? '' : ' (published data)'}` : sel.curve.source}</dd></div>
                  {sel.type === 'curve' && <div><dt className="inline font-medium">Added by: </dt><dd className="inline text-ink-soft">{sel.curve.createdBy?.name ?? '—'}, {new Date(sel.curve.createdAt).toLocaleDateString()} · used by {sel.curve.usedBy} look{sel.curve.usedBy === 1 ? '' : 's'}</dd></div>}
                </dl>
              </>
            )}
          </Card>
          {canEdit ? (
            <Card>
              <h2 className="mb-2">Add to this production's library</h2>
              <div className="mb-3 flex flex-wrap gap-1" role="tablist" aria-label="How the curve is given">
                {([['table', 'Upload a table'], ['parametric', 'Parametric filter'], ['gel', 'A light through a gel']] as const).map(([m, label]) => (
                  <button key={m} type="button" role="tab" aria-selected={mode === m} onClick={() => setMode(m)} className={`rounded-md border px-2 py-1 text-sm ${mode === m ? 'border-ink bg-ink text-paper' : 'border-paper-line bg-paper-raised hover:bg-paper-sunk'}`}>{label}</button>
                ))}
              </div>
              {saved && <div className="mb-3"><Notice>Saved “{saved}” to the library.</Notice></div>}
              {mode === 'table' && <CurveUploadForm pending={create.isPending} error={create.error} onSubmit={submit} />}
              {mode === 'parametric' && <ParametricFilterForm pending={create.isPending} error={create.error} onSubmit={submit} />}
              {mode === 'gel' && <GelLightForm lights={pick('light')} filters={pick('filter')} pending={create.isPending} error={create.error} onSubmit={submit} />}
            </Card>
          ) : <Notice>Editors and owners add curves to the library.</Notice>}
        </div>
      </div>
    </>
  );
}
