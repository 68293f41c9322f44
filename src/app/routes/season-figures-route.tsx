import { Link, useNavigate, useParams } from 'react-router-dom';
import { figuresCsvUrl, useFigures } from '../../features/figures/api/get-figures';
import { FiguresView } from '../../features/figures/components/figures-view';
import { scopeSentence } from '../../features/figures/lib/figures-rows';
import { useSeasons } from '../../features/seasons/api/get-seasons';
import { Alert } from '../../components/ui/alert';
import { buttonClasses } from '../../components/ui/button';
import { Select } from '../../components/ui/field';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';
import { useSignedIn } from './use-signed-in';

export function SeasonFiguresRoute() {
  const { seasonId = '' } = useParams();
  const me = useSignedIn();
  const navigate = useNavigate();
  const figures = useFigures(seasonId);
  const seasons = useSeasons();

  if (figures.isPending) return <Loading label="Adding up the season's figures…" />;
  if (figures.isError) {
    return (
      <>
        <title>Season figures · Heelwood</title>
        <PageHeader title="Season figures" />
        <Alert tone="danger" title="The figures did not load">
          {errorMessage(figures.error)} <Link to={paths.seasons()}>All seasons</Link>
        </Alert>
      </>
    );
  }
  const f = figures.data;
  const whose = f.scope === 'cooperative' ? 'Cooperative figures' : 'Your figures';
  return (
    <>
      <title>{`Figures · ${f.season.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(f.season.id)}>{f.season.name}</Link>
      </p>
      <PageHeader
        title={`${whose}: ${f.season.name}`}
        lead={scopeSentence(f, me.farms.map((farm) => farm.farmName))}
        actions={
          <a href={figuresCsvUrl(f.season.id)} download className={buttonClasses('secondary')}>
            Download the figures (CSV)
          </a>
        }
      />
      {seasons.data && seasons.data.items.length > 1 ? (
        <div className="mb-5 flex max-w-md flex-col gap-1.5">
          <label htmlFor="figures-season" className="font-medium">
            Season
          </label>
          <Select id="figures-season" value={f.season.id} onChange={(event) => navigate(paths.seasonFigures(event.target.value))}>
            {seasons.data.items.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </Select>
        </div>
      ) : null}
      <FiguresView figures={f} />
    </>
  );
}
