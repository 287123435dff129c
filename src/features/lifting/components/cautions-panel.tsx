import { Alert } from '../../../components/ui/index.ts';

/**
 * The cautions that go with every lifting verdict, shown wherever a verdict is. The wording comes
 * from the core with the verdict itself, so screen and paper always say the same.
 */
export function CautionsPanel({ cautions, title = 'Lifting cautions' }: { cautions: readonly string[]; title?: string }) {
  return (
    <Alert tone="caution" title={title}>
      <ul className="list-disc space-y-0.5 pl-5" aria-label={title}>
        {cautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </Alert>
  );
}
