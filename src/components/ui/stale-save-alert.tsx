import type { ReactNode } from 'react';
import { Alert } from './alert.tsx';
import { Button } from './button.tsx';

export interface StaleField {
  label: string;
  theirs: ReactNode;
  mine: ReactNode;
}

export interface StaleSaveAlertProps {
  /** The heading, e.g. "Someone else saved this section while you were editing". */
  title: string;
  /** The fields, as shown to a person, of their version and of this person's edit; equal ones are left out. */
  fields: StaleField[];
  busy?: boolean;
  /** Take their version and drop my edits. */
  onReload: () => void;
  /** Save my edits on top of their version. */
  onKeepMine: () => void;
  /** A line under the table, e.g. what "Keep mine" will do to an approval. */
  note?: ReactNode;
}

const same = (a: ReactNode, b: ReactNode) => (typeof a === 'string' || typeof a === 'number') && (typeof b === 'string' || typeof b === 'number') && String(a) === String(b);

/**
 * Someone saved while this person was editing (the server answered 409 with the current record).
 * Nothing is overwritten silently: show what differs and let the person choose to reload or keep theirs.
 * Every editor shows this one box so the choice reads the same everywhere.
 */
export function StaleSaveAlert({ title, fields, busy = false, onReload, onKeepMine, note }: StaleSaveAlertProps) {
  const differing = fields.filter((f) => !same(f.theirs, f.mine));
  return (
    <Alert
      tone="caution"
      title={title}
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
                Field
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
            {differing.map((f) => (
              <tr key={f.label} className="border-t border-caution-300">
                <th scope="row" className="py-1 pr-4 font-medium">
                  {f.label}
                </th>
                <td className="py-1 pr-4">{f.theirs}</td>
                <td className="py-1">{f.mine}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {note && <p className="mt-2 text-sm">{note}</p>}
    </Alert>
  );
}
