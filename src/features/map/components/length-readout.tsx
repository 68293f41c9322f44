import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { formatMetres, plannerLength } from '../lib/length';

/**
 * The geodesic length of the drawn hedgerow line, and the way on to the planner with it.
 * `lengthM` comes from shared/geo.ts lineLengthM (see ../lib/length.ts).
 */
export function LengthReadout({ lengthM, points, finished }: { lengthM: number; points: number; finished: boolean }) {
  const ready = finished && points >= 2 && lengthM > 0;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-ink" aria-live="polite">
        <span className="block text-sm text-ink-soft">Hedgerow length</span>
        <span className="text-2xl font-semibold tabular-nums" data-testid="hedgerow-length">
          {formatMetres(lengthM)}
        </span>
        <span className="block text-sm text-ink-soft">
          {points < 2 ? 'Place at least two points.' : `${points} points, measured on the WGS84 ellipsoid.`}
        </span>
      </p>
      {ready ? (
        <ButtonLink to={paths.planner({ lengthM: plannerLength(lengthM) })} variant="primary">
          Plan this hedgerow
        </ButtonLink>
      ) : null}
    </div>
  );
}
