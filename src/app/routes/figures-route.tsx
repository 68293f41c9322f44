import { Navigate } from 'react-router-dom';
import type { Season } from '../../../shared/schemas/seasons';
import { useSeasons } from '../../features/seasons/api/get-seasons';
import { Alert } from '../../components/ui/alert';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

/** The season whose figures say most: the latest with collections under way or done, else the latest. */
export function figuresSeason(seasons: Season[]): Season | undefined {
  const latest = [...seasons].sort((a, b) => b.collectionStart.localeCompare(a.collectionStart));
  return latest.find((s) => s.stage === 'collections' || s.stage === 'closed') ?? latest[0];
}

/** "Figures" in the navigation: opens the figures of the season that has most to show. */
export function FiguresRoute() {
  const seasons = useSeasons();
  if (seasons.isPending) return <Loading label="Finding the latest season…" />;
  if (seasons.isError) {
    return (
      <>
        <title>Figures · Heelwood</title>
        <PageHeader title="Season figures" />
        <Alert tone="danger">{errorMessage(seasons.error)}</Alert>
      </>
    );
  }
  const season = figuresSeason(seasons.data.items);
  if (!season) {
    return (
      <>
        <title>Figures · Heelwood</title>
        <PageHeader title="Season figures" />
        <EmptyState title="No season yet">Figures are kept per season. Once a coordinator opens a season and wood is offered and asked for, its figures appear here.</EmptyState>
      </>
    );
  }
  return <Navigate to={paths.seasonFigures(season.id)} replace />;
}
