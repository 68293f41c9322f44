// The plant list's filters live in the URL, so a filtered list can be bookmarked, shared,
// exported and printed as labels. These two functions are the only readers and writers.
import { HEALTH_STATUSES, PLANT_ROLES, type HealthStatus, type PlantRole } from '../../../../shared/domain';
import { PLANT_SORTS, type PlantSort } from '../../../../shared/schemas/register';
import type { PlantListParams } from './keys';

export const PLANT_PAGE_SIZES = [25, 50, 100] as const;
export const DEFAULT_PLANT_PAGE_SIZE = 25;
/** More than this many hand-picked plants: print the filtered list instead. */
export const MAX_CHOSEN_FOR_LABELS = 100;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function year(value: string | null): number | undefined {
  if (!value || !/^\d{4}$/.test(value)) return undefined;
  const n = Number(value);
  return n >= 1900 && n <= 2200 ? n : undefined;
}

function id(value: string | null): string | undefined {
  return value && UUID.test(value) ? value : undefined;
}

export function readPlantParams(params: URLSearchParams): PlantListParams {
  const status = (params.get('status') ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter((s): s is HealthStatus => (HEALTH_STATUSES as readonly string[]).includes(s));
  const role = params.get('role');
  const inspected = params.get('inspected');
  const sort = params.get('sort');
  const page = Number.parseInt(params.get('page') ?? '1', 10);
  const pageSize = Number.parseInt(params.get('pageSize') ?? '', 10);
  return {
    q: params.get('q')?.trim().slice(0, 100) || undefined,
    farmId: id(params.get('farmId')),
    speciesId: id(params.get('speciesId')),
    varietyId: id(params.get('varietyId')),
    status: status.length ? [...new Set(status)] : undefined,
    role: (PLANT_ROLES as readonly string[]).includes(role ?? '') ? (role as PlantRole) : undefined,
    yearFrom: year(params.get('yearFrom')),
    yearTo: year(params.get('yearTo')),
    inspected: inspected === 'never' || inspected === 'stale' || inspected === 'recent' ? inspected : undefined,
    mine: params.get('mine') === 'true' || undefined,
    sort: (PLANT_SORTS as readonly string[]).includes(sort ?? '') ? (sort as PlantSort) : 'code',
    dir: params.get('dir') === 'desc' ? 'desc' : 'asc',
    page: Number.isFinite(page) && page > 0 ? page : 1,
    pageSize: (PLANT_PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : DEFAULT_PLANT_PAGE_SIZE,
  };
}

/**
 * The filters as query parameters. Defaults are left out so addresses stay short;
 * `paging: false` drops page and page size (for export and labels, which take everything).
 */
export function plantParamsToSearch(p: Partial<PlantListParams>, { paging = true }: { paging?: boolean } = {}): URLSearchParams {
  const out = new URLSearchParams();
  const set = (key: string, value: string | number | undefined) => {
    if (value !== undefined && value !== '') out.set(key, String(value));
  };
  set('q', p.q);
  set('farmId', p.farmId);
  set('speciesId', p.speciesId);
  set('varietyId', p.varietyId);
  if (p.status?.length) out.set('status', p.status.join(','));
  set('role', p.role);
  set('yearFrom', p.yearFrom);
  set('yearTo', p.yearTo);
  set('inspected', p.inspected);
  if (p.mine) out.set('mine', 'true');
  if (p.sort && p.sort !== 'code') set('sort', p.sort);
  if (p.dir === 'desc') set('dir', 'desc');
  if (paging) {
    if (p.page && p.page > 1) set('page', p.page);
    if (p.pageSize && p.pageSize !== DEFAULT_PLANT_PAGE_SIZE) set('pageSize', p.pageSize);
  }
  return out;
}

/** How many filters narrow the list (sorting and paging do not count). */
export function activeFilterCount(p: PlantListParams): number {
  return [p.q, p.farmId, p.speciesId, p.varietyId, p.status?.length, p.role, p.yearFrom, p.yearTo, p.inspected, p.mine].filter(Boolean).length;
}

/** The API wants status as a comma list, mine as text. */
export function toApiQuery(p: Partial<PlantListParams>): Record<string, string | number | undefined> {
  return {
    q: p.q,
    farmId: p.farmId,
    speciesId: p.speciesId,
    varietyId: p.varietyId,
    status: p.status?.length ? p.status.join(',') : undefined,
    role: p.role,
    yearFrom: p.yearFrom,
    yearTo: p.yearTo,
    inspected: p.inspected,
    mine: p.mine ? 'true' : undefined,
    sort: p.sort,
    dir: p.dir,
    page: p.page,
    pageSize: p.pageSize,
  };
}

/** The address of the CSV file of the current list (all pages). */
export function exportCsvHref(p: PlantListParams): string {
  const qs = plantParamsToSearch(p, { paging: false }).toString();
  return qs ? `/api/mother-plants/export.csv?${qs}` : '/api/mother-plants/export.csv';
}
