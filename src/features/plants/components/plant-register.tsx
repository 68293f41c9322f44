import type { RowSelectionState } from '@tanstack/react-table';
import { useId, useState } from 'react';
import type { Species } from '../../../../shared/schemas/register';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Select } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { errorMessage } from '../../../lib/api-client';
import { usePlants } from '../api/get-plants';
import type { PlantListParams } from '../api/keys';
import { MAX_CHOSEN_FOR_LABELS, PLANT_PAGE_SIZES, activeFilterCount, exportCsvHref, plantParamsToSearch } from '../api/plant-params';
import { PlantFilters, type FarmOption } from './plant-filters';
import { PlantsTable } from './plants-table';

export function PlantRegister({
  params,
  onParamsChange,
  farms,
  species,
  showMine,
  canAdd,
}: {
  params: PlantListParams;
  onParamsChange: (next: Partial<PlantListParams>) => void;
  farms: FarmOption[];
  species: Species[];
  showMine: boolean;
  /** Farm people and coordinators add, import and change plants. */
  canAdd: boolean;
}) {
  const plants = usePlants(params);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const pageSizeId = useId();
  const chosen = Object.keys(selection).filter((id) => selection[id]);
  const filtered = activeFilterCount(params) > 0;
  const total = plants.data?.total ?? 0;

  const labelsHref =
    chosen.length > 0 ? paths.plantLabels(new URLSearchParams({ ids: chosen.join(',') })) : paths.plantLabels(plantParamsToSearch(params, { paging: false }));

  return (
    <div>
      <div className="mb-5 flex flex-wrap gap-2">
        {canAdd ? <ButtonLink to={paths.plantNew(params.farmId)}>Add a plant</ButtonLink> : null}
        {canAdd ? (
          <ButtonLink variant="secondary" to={paths.plantImport()}>
            Import CSV
          </ButtonLink>
        ) : null}
        <a className={buttonClasses('secondary')} href={exportCsvHref(params)} download>
          Export CSV{filtered ? ' (this list)' : ''}
        </a>
        {chosen.length > MAX_CHOSEN_FOR_LABELS ? (
          <span className="self-center text-sm text-ink-soft">Choose at most {MAX_CHOSEN_FOR_LABELS} plants to print, or print a filtered list.</span>
        ) : (
          <ButtonLink variant="secondary" to={labelsHref}>
            {chosen.length > 0 ? `Print labels (${chosen.length} chosen)` : 'Print labels'}
          </ButtonLink>
        )}
      </div>

      <PlantFilters params={params} onChange={onParamsChange} farms={farms} species={species} showMine={showMine} />

      {chosen.length > 0 ? (
        <div role="status" className="mb-3 flex flex-wrap items-center gap-3 rounded-lg bg-leaf-light px-4 py-2">
          <span className="font-medium">
            {chosen.length} {chosen.length === 1 ? 'plant' : 'plants'} chosen for labels
          </span>
          <Button size="sm" variant="secondary" onClick={() => setSelection({})}>
            Clear the choice
          </Button>
        </div>
      ) : null}

      {plants.isPending ? (
        <Loading label="Loading plants…" />
      ) : plants.isError ? (
        <Alert tone="danger" title="The plant list did not load">
          {errorMessage(plants.error)} Reload the page to try again.
        </Alert>
      ) : plants.data.items.length === 0 && params.page > 1 ? (
        <EmptyState title={`There is no page ${params.page}`} action={<Button onClick={() => onParamsChange({ page: 1 })}>Go to the first page</Button>}>
          The list is shorter than that now. Start again from its first page.
        </EmptyState>
      ) : plants.data.items.length === 0 ? (
        filtered ? (
          <EmptyState
            title="No plant matches these filters"
            action={
              <Button
                variant="secondary"
                onClick={() =>
                  onParamsChange({
                    q: undefined,
                    farmId: undefined,
                    speciesId: undefined,
                    varietyId: undefined,
                    status: undefined,
                    role: undefined,
                    yearFrom: undefined,
                    yearTo: undefined,
                    inspected: undefined,
                    mine: undefined,
                    page: 1,
                  })
                }
              >
                Clear all filters
              </Button>
            }
          >
            Loosen a filter, check the spelling of the search, or clear the filters to see every plant you may see.
          </EmptyState>
        ) : canAdd ? (
          <EmptyState title="No plants in the register yet" action={<ButtonLink to={paths.plantNew()}>Add your first plant</ButtonLink>}>
            Add each mother plant with its variety, planting year and where it stands, or import a whole list from a CSV file.
          </EmptyState>
        ) : (
          <EmptyState title="No plants to show yet">
            Member farms register their mother plants here. Once a farm has clean plants, you can see them in this list.
          </EmptyState>
        )
      ) : (
        <div aria-busy={plants.isFetching || undefined}>
          <PlantsTable
            plants={plants.data.items}
            total={total}
            page={params.page}
            pageSize={params.pageSize}
            sort={params.sort}
            dir={params.dir}
            selection={selection}
            onSelectionChange={setSelection}
            onPageChange={(page) => {
              onParamsChange({ page });
              window.scrollTo({ top: 0 });
            }}
            onSortChange={(sort, dir) => onParamsChange({ sort, dir, page: 1 })}
            plantHref={paths.plant}
          />
          <div className="mt-3 flex items-center gap-3">
            <label htmlFor={pageSizeId} className="text-sm font-medium">
              Plants per page
            </label>
            <div className="w-28">
              <Select id={pageSizeId} value={params.pageSize} onChange={(event) => onParamsChange({ pageSize: Number(event.target.value), page: 1 })}>
                {PLANT_PAGE_SIZES.map((size) => (
                  <option key={size} value={size}>
                    {size}
                  </option>
                ))}
              </Select>
            </div>
          </div>
        </div>
      )}
    </div>
  );
}
