import { Card } from '../../../components/ui/card';
import type { ActivityEntryView } from '../../../../shared/schemas/activity';
import { entrySentence } from '../lib/entry-sentence';

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** The log as a table, newest first: when, who, what. */
export function ActivityTable({ entries }: { entries: ActivityEntryView[] }) {
  return (
    <Card className="overflow-x-auto p-0">
      <table className="w-full text-sm">
        <caption className="sr-only">Activity, newest first</caption>
        <thead className="border-b border-paper-line text-left text-xs uppercase tracking-wide text-ink-mute">
          <tr><th className="px-4 py-2">When</th><th className="px-4 py-2">Who</th><th className="px-4 py-2">What</th></tr>
        </thead>
        <tbody>
          {entries.map((e) => (
            <tr key={e.id} className="border-b border-paper-line last:border-0 align-top">
              <td className="whitespace-nowrap px-4 py-2 text-ink-soft"><time dateTime={e.at} title={e.at}>{when.format(new Date(e.at))}</time></td>
              <td className="whitespace-nowrap px-4 py-2 font-medium">{e.actor.name}{e.actor.id === null && <span className="text-ink-mute"> (account deleted)</span>}</td>
              <td className="px-4 py-2">{entrySentence(e)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
