import { CheckboxField } from '../../../components/ui/index.ts';
import type { VenueSummary } from '../api/get-productions.ts';

interface VenuePickerProps {
  venues: VenueSummary[];
  /** Ids of the chosen venues. */
  value: string[];
  onChange: (ids: string[]) => void;
  error?: string;
}

/** The venues a venue user works for: they see only those venues' engagements. */
export function VenuePicker({ venues, value, onChange, error }: VenuePickerProps) {
  const toggle = (id: string, on: boolean) => onChange(on ? [...value, id] : value.filter((v) => v !== id));
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 text-sm font-semibold text-ink-800">Venues</legend>
      {venues.length === 0 ? (
        <p className="text-sm text-ink-700">This production has no venues yet. Add them to the tour first.</p>
      ) : (
        venues.map((v) => <CheckboxField key={v.id} label={v.name} checked={value.includes(v.id)} onChange={(e) => toggle(v.id, e.target.checked)} />)
      )}
      {error && <p className="text-sm font-medium text-danger-700">{error}</p>}
    </fieldset>
  );
}
