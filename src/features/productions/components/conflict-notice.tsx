import { Alert, Button } from '../../../components/ui/index.ts';
import type { ProductionView } from '../api/get-production.ts';

interface Values {
  name: string;
  paperSize: string;
  defaultUnits: string;
}

const LABELS: Record<keyof Values, string> = { name: 'Name', paperSize: 'Paper size', defaultUnits: 'Units on paperwork' };

export interface ConflictNoticeProps {
  mine: Values;
  theirs: ProductionView;
  busy: boolean;
  /** Take their version and drop my edits. */
  onReload: () => void;
  /** Save my edits on top of their version. */
  onKeepMine: () => void;
}

/**
 * Someone saved while this person was editing (409). Nothing is overwritten silently: show what
 * differs and let the person choose.
 */
export function ConflictNotice({ mine, theirs, busy, onReload, onKeepMine }: ConflictNoticeProps) {
  const differing = (Object.keys(LABELS) as Array<keyof Values>).filter((key) => String(theirs[key]) !== mine[key]);
  return (
    <Alert
      tone="caution"
      title="Someone else saved these settings while you were editing"
      actions={
        <>
          <Button variant="secondary" onClick={onReload} disabled={busy}>
            Reload their version
          </Button>
          <Button onClick={onKeepMine} loading={busy}>
            Keep mine
          </Button>
        </>
      }
    >
      {differing.length === 0 ? (
        <p>Their version matches yours. Keep mine to save anyway.</p>
      ) : (
        <table className="mt-2 w-full text-left text-sm">
          <thead>
            <tr>
              <th scope="col" className="py-1 pr-4 font-semibold">
                Setting
              </th>
              <th scope="col" className="py-1 pr-4 font-semibold">
                Theirs
              </th>
              <th scope="col" className="py-1 font-semibold">
                Yours
              </th>
            </tr>
          </thead>
          <tbody>
            {differing.map((key) => (
              <tr key={key} className="border-t border-caution-300">
                <th scope="row" className="py-1 pr-4 font-medium">
                  {LABELS[key]}
                </th>
                <td className="py-1 pr-4">{String(theirs[key])}</td>
                <td className="py-1">{mine[key]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Alert>
  );
}
