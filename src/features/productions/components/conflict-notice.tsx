import { StaleSaveAlert } from '../../../components/ui/index.ts';
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

/** Someone saved the production's settings while this person was editing (409). */
export function ConflictNotice({ mine, theirs, busy, onReload, onKeepMine }: ConflictNoticeProps) {
  const fields = (Object.keys(LABELS) as Array<keyof Values>).map((key) => ({ label: LABELS[key], theirs: String(theirs[key]), mine: mine[key] }));
  return <StaleSaveAlert title="Someone else saved these settings while you were editing" fields={fields} busy={busy} onReload={onReload} onKeepMine={onKeepMine} />;
}
