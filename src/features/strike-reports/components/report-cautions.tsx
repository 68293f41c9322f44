import { safetyCautions } from '../../../../shared/planner';
import { CautionMark, SafetyCard } from '../../../components/ui/safety-card';

// The project's one list of cautions (shared/planner.ts), so the words match the planner's.
const HORMONE = safetyCautions({ hormone: true }).find((line) => line.startsWith('Rooting hormone'));

/** Beside a treatment that uses rooting hormone. */
export function HormoneCaution({ id }: { id?: string }) {
  if (!HORMONE) return null;
  return (
    <div id={id} className="flex gap-2 rounded-lg border-l-4 border-amber bg-amber-light px-3 py-2 text-sm">
      <CautionMark size={16} />
      <p>
        <span className="font-semibold">Caution: </span>
        {HORMONE}
      </p>
    </div>
  );
}

/** "Working safely" on the bundles page: lifting, trimming and potting rooted cuttings. */
export function ReportCautions() {
  return <SafetyCard cautions={safetyCautions({ hormone: true })} />;
}
