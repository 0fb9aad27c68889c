import { Link, useParams } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { ErrorMessage, Spinner } from '../../components/ui/alert';
import { exposureSheetPdfUrl, useExposureSheet } from '../../features/exposure/api/get-exposure-sheet';
import { ExposureSheetView } from '../../features/exposure/components/exposure-sheet-view';
import { paths } from '../../lib/paths';

const PRINT_CSS = `
@page { size: A4; margin: 12mm; }
@media print {
  .sheet * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  .sheet section { break-inside: avoid; }
  .sheet .sheet-swatches tr { break-inside: avoid; }
  main { max-width: none !important; padding: 0 !important; }
}`;

/** The exposure sheet of a look: a printable page for the camera crew, with the same content as its PDF. */
export default function ExposureSheetPage() {
  const params = useParams();
  const pid = Number(params.productionId);
  const lookId = Number(params.lookId);
  const q = useExposureSheet(pid, lookId);
  const s = q.data?.sheet;
  return (
    <div className="sheet mx-auto max-w-4xl">
      <style>{PRINT_CSS}</style>
      <div className="no-print mb-4 flex flex-wrap items-center gap-2">
        <Link to={paths.production(pid).bench(lookId)} className="text-sm text-accent hover:underline">← Back to the bench</Link>
        <span className="ml-auto" />
        <Button onClick={() => window.print()} disabled={!s}>Print</Button>
        <a href={exposureSheetPdfUrl(pid, lookId)} download className="inline-flex items-center rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-strong">
          Download PDF
        </a>
      </div>
      {q.isPending && <Spinner />}
      <ErrorMessage error={q.error} />
      {s && <ExposureSheetView s={s} />}
    </div>
  );
}
