import { Link, useParams, useSearchParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { exposureSheetPdfUrl, useExposureSheet } from '../../features/exposure/api/get-exposure-sheet';
import { ExposureSheetView } from '../../features/exposure/components/exposure-sheet-view';
import { SheetBoardPicker } from '../../features/exposure/components/sheet-board-picker';
import { DaySheetsDownload } from '../../features/exposure/components/day-sheets-download';
import { useLooks } from '../../features/looks/api/get-looks';
import { paths } from '../../lib/paths';

const PRINT_CSS = `
@page { size: A4; margin: 12mm; }
@media print {
  .sheet * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  .sheet section { break-inside: avoid; }
  .sheet section:has(.sheet-swatches) { break-inside: auto; }
  .sheet .sheet-swatches thead { display: table-header-group; }
  .sheet .sheet-swatches tr { break-inside: avoid; }
  main { max-width: none !important; padding: 0 !important; }
}`;

/** `?boards=1,2` of the page's address: the boards picked (an empty value picks none), or undefined. */
function pickedBoards(v: string | null): number[] | undefined {
  if (v === null) return undefined;
  return v.split(',').map(Number).filter((n) => Number.isSafeInteger(n) && n > 0);
}

/**
 * The exposure sheet of a look: a printable page for the camera crew, with the same content as its PDF.
 * The boards it lists can be picked (kept in the address as `?boards=`); the day's looks download as one PDF.
 */
export default function ExposureSheetPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const lookId = Number(params.lookId);
  const [search, setSearch] = useSearchParams();
  const boards = pickedBoards(search.get('boards'));
  const q = useExposureSheet(pid, lookId, boards);
  const looks = useLooks(pid).data?.looks;
  const s = q.data?.sheet;
  const pick = (ids: number[] | null) => setSearch(ids === null ? {} : { boards: ids.join(',') }, { replace: true });
  return (
    <div className="sheet mx-auto max-w-4xl">
      <style>{PRINT_CSS}</style>
      <div className="no-print mb-4 flex flex-wrap items-center gap-2">
        <Link to={paths.production(pid).bench(lookId)} className="text-sm text-accent hover:underline">← Back to the bench</Link>
        <span className="ml-auto" />
        <Button onClick={() => window.print()} disabled={!s}>Print</Button>
        <a href={exposureSheetPdfUrl(pid, lookId, boards)} download className="inline-flex items-center rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-strong">
          Download PDF
        </a>
      </div>
      {q.isPending && <Spinner />}
      <ErrorMessage error={q.error} />
      {looks && looks.length > 0 && <DaySheetsDownload key={lookId} pid={pid} looks={looks} currentLookId={lookId} />}
      {s && <SheetBoardPicker s={s} picked={boards} onPick={pick} />}
      {s && <ExposureSheetView s={s} />}
    </div>
  );
}
