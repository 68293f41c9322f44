import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useSeason } from '../../features/seasons/api/get-season';
import { useMyRequest } from '../../features/wood-requests/api/get-my-request';
import { useWoodBoard } from '../../features/wood-requests/api/get-wood-board';
import { WoodBoardTable } from '../../features/wood-requests/components/wood-board-table';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { StatusBadge } from '../../components/ui/status-badge';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

function readPlace(params: URLSearchParams): { lat: number; lon: number } | null {
  const lat = Number(params.get('lat'));
  const lon = Number(params.get('lon'));
  if (!params.has('lat') || !params.has('lon') || !Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) return null;
  return { lat, lon };
}

export function WoodBoardRoute() {
  const { seasonId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const season = useSeason(seasonId);
  const mine = useMyRequest(seasonId);
  const [locating, setLocating] = useState<{ state: 'idle' | 'asking' | 'error'; message?: string }>({ state: 'idle' });

  // Distances from: a place in the address (my position), else my request's destination.
  const typed = readPlace(params);
  const request = mine.data?.request ?? null;
  const fromRequest = request ? { lat: request.destinationLat, lon: request.destinationLon } : null;
  const from = typed ?? fromRequest;
  const board = useWoodBoard(seasonId, mine.isPending && !typed ? null : from);

  const useMyPosition = () => {
    if (!('geolocation' in navigator)) {
      setLocating({ state: 'error', message: 'This browser cannot tell its position.' });
      return;
    }
    setLocating({ state: 'asking' });
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setLocating({ state: 'idle' });
        const round = (x: number) => Math.round(x * 1e4) / 1e4;
        setParams({ lat: String(round(p.coords.latitude)), lon: String(round(p.coords.longitude)) }, { replace: true });
      },
      () => setLocating({ state: 'error', message: 'The position was not shared, so distances are from your request’s place, if any.' }),
      { timeout: 15_000 },
    );
  };

  if (season.isPending) return <Loading label="Loading the season…" />;
  if (season.isError) {
    return (
      <Alert tone="danger" title="The season did not load">
        {errorMessage(season.error)}
      </Alert>
    );
  }
  const s = season.data;
  const rows = board.data?.items ?? [];
  const restrictions = new Map<string, string[]>();
  for (const row of rows) {
    if (!row.restrictionNote) continue;
    const names = restrictions.get(row.restrictionNote) ?? [];
    if (!names.includes(row.speciesName)) names.push(row.speciesName);
    restrictions.set(row.restrictionNote, names);
  }

  return (
    <>
      <title>{`Wood board, ${s.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(s.id)}>{s.name}</Link>
      </p>
      <PageHeader
        title="Wood board"
        lead="What farms offer this season and what growers ask for, by species and variety. Where more is asked than offered the wood is scarce, and the coordinator shares it out fairly."
        actions={<StatusBadge status={s.stage} className="text-base" />}
      />
      <div className="mb-5 flex flex-col gap-3 rounded-card border border-paper-edge bg-white/60 p-4 sm:flex-row sm:items-center sm:justify-between">
        <p>
          {from ? (
            <>
              Distances are to the nearest offering farm from{' '}
              <strong>{typed ? 'your position' : request?.destinationLabel || 'your request’s place'}</strong> ({from.lat.toFixed(4)}, {from.lon.toFixed(4)}).
            </>
          ) : (
            'Give a place to see how far the nearest offering farm is.'
          )}
        </p>
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" size="sm" onClick={useMyPosition} busy={locating.state === 'asking'}>
            Use my position
          </Button>
          {typed && fromRequest ? (
            <Button variant="quiet" size="sm" onClick={() => setParams({}, { replace: true })}>
              Use my request’s place
            </Button>
          ) : null}
        </div>
      </div>
      {locating.state === 'error' ? <p className="mb-4 font-medium text-rust">{locating.message}</p> : null}
      <div className="mb-4 text-sm text-ink-soft">
        <p>Pressure is what is asked as a share of what is offered.</p>
        <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-2">
          <li className="flex items-center gap-2">
            <StatusBadge status="enough" /> up to 100 %
          </li>
          <li className="flex items-center gap-2">
            <StatusBadge status="scarce" /> over 100 %
          </li>
          <li className="flex items-center gap-2">
            <StatusBadge status="unoffered" /> asked, none offered
          </li>
        </ul>
      </div>
      {board.isPending ? (
        <Loading label="Loading the wood board…" />
      ) : board.isError ? (
        <Alert tone="danger" title="The wood board did not load">
          {errorMessage(board.error)}
        </Alert>
      ) : (
        <div aria-busy={board.isFetching || undefined}>
          <WoodBoardTable rows={rows} hasPlace={from !== null} />
        </div>
      )}
      {restrictions.size ? (
        <div className="mt-6 flex flex-col gap-3">
          {[...restrictions.entries()].map(([note, names]) => (
            <Alert key={note} tone="warning" title={`Moving ${names.join(', ')}`}>
              {note}
            </Alert>
          ))}
        </div>
      ) : null}
    </>
  );
}
