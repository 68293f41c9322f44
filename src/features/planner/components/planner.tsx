import { useId, useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { LABELS, TREATMENTS, type Hemisphere, type SeasonKind } from '../../../../shared/domain';
import { PLANNER_LIMITS } from '../../../../shared/planner';
import type { Species } from '../../../../shared/schemas/register';
import type { RequestLineSearch, StrikeRatesSearch } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { useEstimate } from '../api/estimate-planting';
import {
  checkPlan,
  CONFIDENCE_CHOICES,
  defaultPlanValues,
  localFigures,
  planRecord,
  planResolver,
  rateKeyOf,
  type PlanFormValues,
  type PlanMode,
  type PlanStart,
} from '../lib/plan-form';
import { useDebounced } from '../lib/use-debounced';
import { pct } from '../lib/words';
import { PlanGuidance } from './plan-guidance';
import { PlanResults } from './plan-results';

const MODES: Array<{ mode: PlanMode; label: string; hint: string }> = [
  { mode: 'hedgerow', label: 'A hedgerow or row', hint: 'Length, spacing and rows' },
  { mode: 'positions', label: 'A number of positions', hint: 'Shrubs beside trees, a bed' },
  { mode: 'rooted', label: 'A number of rooted plants', hint: 'For a nursery bed' },
];

export type RequestSeasonChoice = { id: string; name: string };

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * The planting planner. The grower describes a planting; the page shows, as they type, the
 * cuttings to ask for and how well they fill it. The figures come from shared/planner.ts
 * (run here for speed) and from the server, which also finds the learned strike rate.
 */
export function Planner({
  species,
  hemisphere,
  seasonKind,
  requestSeasons,
  start,
  onAddToRequest,
  strikeRatesHref,
}: {
  species: Species[];
  hemisphere: Hemisphere;
  seasonKind: SeasonKind | null;
  requestSeasons: RequestSeasonChoice[];
  start?: PlanStart;
  onAddToRequest: (seasonId: string, line: RequestLineSearch) => void;
  /** Where the strike-rate table for a species, variety and treatment is (the page knows the routes). */
  strikeRatesHref?: (search: StrikeRatesSearch) => string;
}) {
  const id = useId();
  const form = useForm<PlanFormValues>({ defaultValues: defaultPlanValues(start), resolver: planResolver(), mode: 'onChange' });
  const values = useWatch({ control: form.control }) as PlanFormValues;
  const { errors } = form.formState;
  const check = useMemo(() => checkPlan(values), [values]);
  const body = useDebounced(check.input ? check.body : null, 250, sameJson);
  const estimate = useEstimate(body);
  const [seasonId, setSeasonId] = useState(requestSeasons[0]?.id ?? '');

  const chosen = species.find((s) => s.id === values.speciesId) ?? null;
  const variety = chosen?.varieties.find((v) => v.id === values.varietyId) ?? null;
  const names = { species: chosen?.commonName ?? 'this species', variety: variety?.name ?? null };

  // The server's answer for exactly these inputs, else the shared functions run here with the
  // strike rate the server found for the same species, variety and treatment.
  const data = estimate.data;
  const fresh = data && check.input && !estimate.isPlaceholderData && sameJson(data.body, check.body) ? data.estimate : null;
  const knownRate = data && rateKeyOf(data.body) === check.rateKey ? data.estimate.strikeRate : null;
  const local = !fresh && check.input && knownRate ? localFigures(check.input, knownRate.rate) : null;
  const figures = fresh ?? local;
  const strikeRate = fresh?.strikeRate ?? knownRate;
  const ask = figures ? (values.mode === 'rooted' ? (figures.cuttingsForTarget ?? figures.cuttings) : figures.cuttings) : null;

  const pendingReasons = Object.entries(check.errors).map(([, message]) => message);

  const addToRequest = () => {
    if (!figures || ask === null || !seasonId || !values.speciesId) return;
    onAddToRequest(seasonId, {
      speciesId: values.speciesId,
      varietyId: values.varietyId || null,
      treatment: values.treatment,
      cuttings: ask,
      plan: JSON.stringify(planRecord(values, figures)),
    });
  };

  const numberField = (name: keyof PlanFormValues, label: string, hint?: string, opts: { step?: string; min?: number; max?: number; placeholder?: string } = {}) => (
    <Field label={label} hint={hint} error={namedError(label, errors[name]?.message)}>
      <TextInput type="number" inputMode="decimal" step={opts.step ?? 'any'} min={opts.min} max={opts.max} placeholder={opts.placeholder} {...form.register(name)} />
    </Field>
  );

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-6" aria-label="Describe the planting">
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-2 text-xl font-semibold">The planting</legend>
          <div className="grid gap-2 sm:grid-cols-3">
            {MODES.map((m) => (
              <label
                key={m.mode}
                className={cn(
                  'flex min-h-touch cursor-pointer items-start gap-3 rounded-lg border-2 px-4 py-3',
                  values.mode === m.mode ? 'border-currant bg-currant-light' : 'border-paper-edge bg-white/60 hover:border-bark-light',
                )}
              >
                <input type="radio" value={m.mode} className="mt-1 h-4 w-4 shrink-0 accent-currant" {...form.register('mode')} />
                <span>
                  <span className="block font-semibold">{m.label}</span>
                  <span className="block text-sm text-ink-soft">{m.hint}</span>
                </span>
              </label>
            ))}
          </div>
        </fieldset>

        {values.mode === 'hedgerow' ? (
          <div className="grid grid-cols-2 gap-4 sm:grid-cols-3">
            {numberField('lengthM', 'Length (m)', undefined, { min: 0, max: PLANNER_LIMITS.maxLengthM })}
            {numberField('spacingM', 'Spacing (m)', undefined, { min: 0 })}
            {numberField('rows', 'Rows', undefined, { step: '1', min: 1, max: PLANNER_LIMITS.maxRows })}
            <p className="col-span-2 text-sm text-ink-soft sm:col-span-3">
              A plant at both ends of the row. Usual spacing in the row: currants 0.9–1.2 m, gooseberries 1.2–1.5 m. Rows are parallel and of the same length.
            </p>
          </div>
        ) : values.mode === 'positions' ? (
          <div className="grid gap-4 sm:grid-cols-2">{numberField('positions', 'Planting positions', 'Each place a shrub should stand.', { step: '1', min: 1 })}</div>
        ) : null}

        {values.mode !== 'rooted' ? (
          <div className="grid gap-4 sm:grid-cols-2">
            {numberField('cuttingsPerPosition', 'Cuttings per position', 'Two is common practice; a third makes an empty place rarer.', {
              step: '1',
              min: 1,
              max: PLANNER_LIMITS.maxCuttingsPerPosition,
            })}
          </div>
        ) : null}

        <fieldset className="flex flex-col gap-4">
          <legend className="mb-1 text-xl font-semibold">The wood</legend>
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Species" error={namedError('Species', errors.speciesId?.message)}>
              <Select
                {...form.register('speciesId', {
                  onChange: () => form.setValue('varietyId', ''),
                })}
              >
                <option value="">Choose a species</option>
                {species.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.commonName} ({s.scientificName})
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Variety" error={namedError('Variety', errors.varietyId?.message)}>
              <Select disabled={!chosen} {...form.register('varietyId')}>
                <option value="">Any variety of this species</option>
                {(chosen?.varieties ?? []).map((v) => (
                  <option key={v.id} value={v.id}>
                    {v.name}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Treatment before sticking" error={namedError('Treatment', errors.treatment?.message)}>
              <Select {...form.register('treatment')}>
                {TREATMENTS.map((t) => (
                  <option key={t} value={t}>
                    {LABELS.treatment[t]}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
        </fieldset>

        <fieldset className="flex flex-col gap-4">
          <legend className="mb-1 text-xl font-semibold">{values.mode === 'rooted' ? 'Rooted plants wanted' : 'Also: a number of rooted plants'}</legend>
          {values.mode !== 'rooted' ? (
            <p className="text-ink-soft">How many cuttings to stick to be fairly sure of a number of rooted plants, for example in a nursery bed before planting out.</p>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            {numberField('rooted', values.mode === 'rooted' ? 'Rooted plants' : 'Rooted plants wanted', values.mode === 'rooted' ? undefined : 'Empty: one for each position.', {
              step: '1',
              min: 1,
              placeholder: values.mode !== 'rooted' && figures ? String(figures.positions) : undefined,
            })}
            <Field label="How sure" hint="The chance of getting at least that many." error={namedError('Confidence', errors.confidence?.message)}>
              <Select {...form.register('confidence')}>
                {CONFIDENCE_CHOICES.map((c) => (
                  <option key={c} value={c}>
                    {pct(Number(c), 0)}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
        </fieldset>
        {figures && ask !== null ? (
          // On a phone the answer comes after the form: this bar keeps it in sight while typing
          // and comes to rest just above it.
          <a
            href="#plan-results-title"
            className="sticky bottom-0 z-10 -mx-4 flex min-h-touch items-center justify-between gap-3 border-t-2 border-leaf/40 bg-leaf-light px-4 py-2 font-semibold text-ink no-underline lg:hidden"
          >
            <span>
              {ask.toLocaleString('en')} cuttings
              {values.mode !== 'rooted' ? <span className="font-normal"> · {pct(figures.fillProbability)} filled</span> : null}
            </span>
            <span className="text-currant underline">Details</span>
          </a>
        ) : null}
      </form>

      <div className="flex flex-col gap-5">
        {figures && strikeRate ? (
          <PlanResults
            mode={values.mode}
            figures={figures}
            strikeRate={strikeRate}
            target={check.input?.target}
            names={names}
            fromServer={fresh !== null}
            ratesHref={strikeRatesHref?.({ speciesId: values.speciesId || undefined, varietyId: values.varietyId || null, treatment: values.treatment })}
          />
        ) : (
          <section aria-labelledby={`${id}-waiting`} className="rounded-card border-2 border-dashed border-paper-edge p-5">
            <h2 id={`${id}-waiting`} className="text-lg font-semibold">
              What to ask for
            </h2>
            {pendingReasons.length ? (
              <>
                <p className="mt-2 text-ink-soft">To see the estimate:</p>
                <ul className="mt-1 flex list-disc flex-col gap-1 pl-5">
                  {pendingReasons.map((reason) => (
                    <li key={reason}>{reason}</li>
                  ))}
                </ul>
              </>
            ) : estimate.isError ? null : (
              <p className="mt-2 text-ink-soft">Working out the strike rate…</p>
            )}
          </section>
        )}
        {estimate.isError ? <Alert tone="danger" title="The server could not check this plan">{errorMessage(estimate.error)}</Alert> : null}
        <div className="flex flex-col gap-3 rounded-card border border-paper-edge bg-white/60 p-5">
          <h2 className="text-lg font-semibold">Ask for this wood</h2>
          {requestSeasons.length === 0 ? (
            <p className="text-ink-soft">No season is taking requests now. Keep this plan in mind: the planner is here when the next season opens.</p>
          ) : (
            <>
              {requestSeasons.length > 1 ? (
                <Field label="Season">
                  <Select value={seasonId} onChange={(event) => setSeasonId(event.target.value)}>
                    {requestSeasons.map((s) => (
                      <option key={s.id} value={s.id}>
                        {s.name}
                      </option>
                    ))}
                  </Select>
                </Field>
              ) : (
                <p className="text-ink-soft">Adds a line to your request for {requestSeasons[0].name}; you check it there before saving.</p>
              )}
              <Button onClick={addToRequest} disabled={!figures || !values.speciesId}>
                Add to my request
              </Button>
            </>
          )}
        </div>
      </div>

      <div className="lg:col-span-2">
        <PlanGuidance hemisphere={hemisphere} seasonKind={seasonKind} species={chosen} hormone={values.treatment === 'hormone' || values.treatment === 'both'} />
      </div>
    </div>
  );
}
