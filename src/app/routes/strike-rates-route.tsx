import { useCallback, useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { LABELS, TREATMENTS, type Treatment } from '../../../shared/domain';
import { useSpecies } from '../../features/species/api/get-species';
import { METHOD_LABELS } from '../../features/species/components/words';
import { useStrikeRates } from '../../features/strike-reports/api/get-strike-rates';
import { StrikeRateTable } from '../../features/strike-reports/components/strike-rate-table';
import { Alert } from '../../components/ui/alert';
import { ButtonLink } from '../../components/ui/button';
import { Field, Select } from '../../components/ui/field';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

const isTreatment = (t: string | null): t is Treatment => t !== null && (TREATMENTS as readonly string[]).includes(t);

export function StrikeRatesRoute() {
  const [search, setSearch] = useSearchParams();
  const species = useSpecies();
  const speciesId = search.get('speciesId') ?? '';
  const varietyId = search.get('varietyId') ?? '';
  const treatmentParam = search.get('treatment');
  const treatment = isTreatment(treatmentParam) ? treatmentParam : undefined;
  const rates = useStrikeRates({ speciesId: speciesId || undefined, varietyId: varietyId || undefined, treatment });

  const list = species.data?.items ?? [];
  const chosen = list.find((s) => s.id === speciesId) ?? null;
  const methodsOf = useCallback(
    (id: string) => (species.data?.items.find((s) => s.id === id)?.propagationMethods ?? []).map((m) => METHOD_LABELS[m]).join(', '),
    [species.data],
  );
  const choose = (next: { speciesId?: string; varietyId?: string; treatment?: string }) => {
    const merged = { speciesId, varietyId, treatment: treatment ?? '', ...next };
    const params: Record<string, string> = {};
    for (const [k, v] of Object.entries(merged)) if (v) params[k] = v;
    setSearch(params, { replace: true });
  };
  const plannerHref = useMemo(() => paths.planner({ speciesId: speciesId || undefined, varietyId: varietyId || null, treatment }), [speciesId, varietyId, treatment]);

  return (
    <>
      <title>Strike rates · Heelwood</title>
      <PageHeader
        title="Strike rates"
        lead="How many cuttings root, by species, variety and treatment: the reference rate for the species, updated by every strike report growers file. The planner uses these estimates."
        actions={
          <>
            <ButtonLink variant="secondary" to={plannerHref}>
              Planner
            </ButtonLink>
            <ButtonLink variant="secondary" to={paths.myBundles()}>
              My bundles
            </ButtonLink>
          </>
        }
      />
      <form className="mb-5 grid gap-4 sm:grid-cols-3" aria-label="Choose strike rates" onSubmit={(event) => event.preventDefault()}>
        <Field label="Species">
          <Select value={speciesId} disabled={species.isPending} onChange={(event) => choose({ speciesId: event.target.value, varietyId: '' })}>
            <option value="">All species</option>
            {list.map((s) => (
              <option key={s.id} value={s.id}>
                {s.commonName} ({s.scientificName})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Variety">
          <Select value={varietyId} disabled={!chosen} onChange={(event) => choose({ varietyId: event.target.value })}>
            <option value="">{chosen ? 'All varieties with reports' : 'Choose a species first'}</option>
            {(chosen?.varieties ?? []).map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Treatment">
          <Select value={treatment ?? ''} onChange={(event) => choose({ treatment: event.target.value })}>
            <option value="">All treatments</option>
            {TREATMENTS.map((t) => (
              <option key={t} value={t}>
                {LABELS.treatment[t]}
              </option>
            ))}
          </Select>
        </Field>
      </form>
      {rates.isPending ? (
        <Loading label="Loading the strike rates…" />
      ) : rates.isError ? (
        <Alert tone="danger" title="The strike rates did not load">
          {errorMessage(rates.error)}
        </Alert>
      ) : (
        <div aria-busy={rates.isFetching || undefined}>
          <StrikeRateTable rows={rates.data.items} methodsOf={methodsOf} />
        </div>
      )}
      <section className="mt-6 max-w-prose text-ink-soft" aria-labelledby="rates-how">
        <h2 id="rates-how" className="mb-2 text-lg font-semibold text-ink">
          How the estimate is made
        </h2>
        <p>
          Each species has a reference strike rate (the prior) for untreated cuttings; a willow soak or rooting hormone raises it. The reference counts as much as
          a report on as many cuttings as its weight. Every strike report then adds its rooted and failed cuttings, so the posterior mean moves towards what growers actually see, and
          the 90 % interval narrows as reports come in: the true rate lies inside it with 90 % probability.
        </p>
        <p className="mt-2">
          A species row pools all its varieties; a variety row appears once that variety has reports. Reports are pooled across propagation methods (the Method
          column says how the species is propagated). To add yours, open <Link to={paths.myBundles()}>My bundles</Link>.
        </p>
      </section>
    </>
  );
}
