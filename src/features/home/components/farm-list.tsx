import { LABELS } from '../../../../shared/domain';
import type { FarmLink } from '../../../../shared/schemas/members';
import { Card, CardTitle } from '../../../components/ui/card';

export function FarmList({ farms }: { farms: FarmLink[] }) {
  return (
    <Card>
      <CardTitle>Your farms</CardTitle>
      <ul className="flex flex-col divide-y divide-paper-edge">
        {farms.map((farm) => (
          <li key={farm.farmId} className="flex flex-wrap items-baseline justify-between gap-2 py-2">
            <span>
              <span className="font-semibold">{farm.farmName}</span> <span className="text-sm text-ink-soft">({farm.farmCode})</span>
            </span>
            <span className="rounded-full bg-paper-deep px-3 py-0.5 text-sm font-medium">{LABELS.farmRole[farm.farmRole]}</span>
          </li>
        ))}
      </ul>
    </Card>
  );
}
