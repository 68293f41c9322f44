import { useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { usePlantsById } from '../../features/plants/api/get-plant';
import { usePlants } from '../../features/plants/api/get-plants';
import { MAX_CHOSEN_FOR_LABELS, plantParamsToSearch, readPlantParams } from '../../features/plants/api/plant-params';
import { LabelsSheet, type LabelPlant } from '../../features/plants/components/labels-sheet';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

/** The most labels on one sheet run: 200 plants is about 17 A4 pages. */
const LABELS_PER_RUN = 200;
const UUID = /^[0-9a-f-]{36}$/i;

function toLabel(p: LabelPlant): LabelPlant {
  return { id: p.id, code: p.code, varietyName: p.varietyName, speciesName: p.speciesName, scientificName: p.scientificName, farmName: p.farmName };
}

function ChosenLabels({ ids }: { ids: string[] }) {
  const results = usePlantsById(ids);
  const done = results.filter((r) => !r.isPending).length;
  if (done < ids.length) return <Loading label={`Loading the chosen plants: ${done} of ${ids.length}…`} />;
  const failed = results.filter((r) => r.isError);
  const plants = results.flatMap((r) => (r.data ? [toLabel(r.data)] : []));
  return (
    <>
      {failed.length > 0 ? <Alert tone="warning" className="mb-4 print:hidden">{`${failed.length} of the chosen plants could not be loaded and are left out.`}</Alert> : null}
      {plants.length > 0 ? <LabelsSheet plants={plants} origin={window.location.origin} /> : null}
    </>
  );
}

function ListLabels({ search, page }: { search: URLSearchParams; page: number }) {
  const params = { ...readPlantParams(search), page, pageSize: LABELS_PER_RUN };
  const plants = usePlants(params);
  const items = useMemo(() => (plants.data?.items ?? []).map(toLabel), [plants.data]);
  if (plants.isPending) return <Loading label="Loading the plants…" />;
  if (plants.isError) return <Alert tone="danger">The plants did not load: {errorMessage(plants.error)}</Alert>;
  const total = plants.data.total;
  if (total === 0) {
    return (
      <EmptyState title="No plants to label" action={<ButtonLink to={paths.plants(plantParamsToSearch(params, { paging: false }))}>Back to the list</ButtonLink>}>
        No plant matches these filters. Change the filters on the plant list, then print again.
      </EmptyState>
    );
  }
  const first = (page - 1) * LABELS_PER_RUN + 1;
  const last = Math.min(total, page * LABELS_PER_RUN);
  const pageHref = (p: number) => {
    const next = new URLSearchParams(search);
    if (p > 1) next.set('page', String(p));
    else next.delete('page');
    return paths.plantLabels(next);
  };
  return (
    <>
      {total > LABELS_PER_RUN ? (
        <nav aria-label="Label runs" className="mb-4 flex flex-wrap items-center gap-3 print:hidden">
          <span>
            Labels {first}–{last} of {total}.
          </span>
          {page > 1 ? <Link to={pageHref(page - 1)}>Previous {LABELS_PER_RUN}</Link> : null}
          {last < total ? <Link to={pageHref(page + 1)}>Next {LABELS_PER_RUN}</Link> : null}
        </nav>
      ) : null}
      <LabelsSheet plants={items} origin={window.location.origin} />
    </>
  );
}

export function PlantLabelsRoute() {
  const [search] = useSearchParams();
  const ids = (search.get('ids') ?? '')
    .split(',')
    .filter((id) => UUID.test(id))
    .slice(0, MAX_CHOSEN_FOR_LABELS);
  const page = Math.max(1, Number.parseInt(search.get('page') ?? '1', 10) || 1);
  const back = ids.length ? paths.plants() : paths.plants(plantParamsToSearch(readPlantParams(search), { paging: false }));

  return (
    <>
      <title>Plant labels · Heelwood</title>
      <div className="hw-no-print print:hidden">
        <PageHeader
          title="Plant labels"
          lead="Each label carries the plant's code and a QR code that opens its page here. Print on plain or weatherproof A4 sheets and cut along the lines."
          actions={
            <ButtonLink variant="secondary" to={back}>
              Back to the list
            </ButtonLink>
          }
        />
      </div>
      {ids.length > 0 ? <ChosenLabels ids={ids} /> : <ListLabels search={search} page={page} />}
    </>
  );
}
