import type { UnitSystem } from '@domain/units.ts';
import { Alert, Card, ChoiceGroup } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useUnits } from '../../../lib/use-units.ts';
import { useUpdatePreferences } from '../api/update-preferences.ts';

const CHOICES = [
  { value: 'metric', label: 'Metric' },
  { value: 'imperial', label: 'Imperial' },
] as const;

/** The per-user metric / imperial switch. Paperwork follows the production's own setting. */
export function UnitsCard() {
  const units = useUnits();
  const update = useUpdatePreferences();
  const shown: UnitSystem = update.isPending && update.variables ? update.variables.units : units.system;

  return (
    <Card title="Units on screen" description="How lengths and masses are shown to you. Stored data does not change.">
      <div className="flex flex-col gap-4">
        <ChoiceGroup
          legend="Unit system"
          name="units"
          value={shown}
          choices={CHOICES}
          disabled={update.isPending}
          onChange={(value) => update.mutate({ units: value })}
          hint={
            <>
              For example a 1,250 mm part weighing 418.5 kg shows as{' '}
              <strong className="font-semibold text-ink-900">
                {units.formatLength(1250)} and {units.formatMass(418.5)}
              </strong>
              .
            </>
          }
        />
        {update.isError && (
          <Alert tone="danger" title="Could not save your choice">
            {errorMessage(update.error)}
          </Alert>
        )}
        {update.isSuccess && <Alert tone="ok">Saved. Every screen now shows {units.system} units.</Alert>}
      </div>
    </Card>
  );
}
