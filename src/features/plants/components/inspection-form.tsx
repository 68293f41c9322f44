import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch, type FieldError } from 'react-hook-form';
import { LABELS, SEVERITIES, type HealthStatus } from '../../../../shared/domain';
import { statusAfterInspection } from '../../../../shared/health-rules';
import { inspectionCreateSchema, type Pest } from '../../../../shared/schemas/health';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, Select, TextArea, TextInput } from '../../../components/ui/field';
import { StatusBadge } from '../../../components/ui/status-badge';
import { ApiError, errorMessage } from '../../../lib/api-client';
import { pestsForGenus } from '../api/get-pests';
import { useRecordInspection, type InspectionOutcome } from '../api/record-inspection';
import { TravelsInWoodMark } from './wood-mark';
import { named, SEVERITY_LABELS, todayIso } from './words';

export const MAX_FINDINGS = 20;


/** What happened to the plant, in plain words. */
export function describeOutcome(outcome: Pick<InspectionOutcome, 'statusBefore' | 'statusAfter' | 'rule' | 'withdrawnOffers'>): { title: string; body: string } {
  const { statusBefore: before, statusAfter: after } = outcome;
  const withdrawn =
    outcome.withdrawnOffers > 0
      ? ` ${outcome.withdrawnOffers} open wood ${outcome.withdrawnOffers === 1 ? 'offer was' : 'offers were'} withdrawn.`
      : '';
  if (outcome.rule.startsWith('an older inspection')) {
    return { title: 'Inspection recorded', body: 'It is older than the last inspection, so the health status stays as it was.' };
  }
  if (after === 'hold' && before !== 'hold') {
    return {
      title: 'Put on hold: a finding that travels in cutting wood',
      body: `No wood is taken from this plant until a coordinator lifts the hold.${withdrawn}`,
    };
  }
  if (after === 'hold') return { title: 'Still on hold', body: `Only a coordinator lifts a hold.${withdrawn}` };
  if (after === 'watch' && before !== 'watch') {
    return { title: 'Put on watch: a finding that does not travel in wood', body: 'Keep an eye on it at the next inspection.' };
  }
  if (after === 'watch') return { title: 'Still on watch', body: 'A finding that does not travel in wood was recorded again.' };
  if (after === 'clean' && before !== 'clean') return { title: 'Clean again', body: 'No findings this time.' };
  if (after === 'clean') return { title: 'Clean', body: 'No findings.' };
  return { title: `Status: ${LABELS.health[after]}`, body: '' };
}

function findingError(error: FieldError | undefined, label: string, emptyMessage: string): string | undefined {
  if (!error?.message) return undefined;
  // The schema's own wording for an empty choice ("not a valid id") is no help to a grower.
  if (error.type !== 'server' && emptyMessage) return `${label}: ${emptyMessage}`;
  return named(label, error.message);
}

export function InspectionForm({
  plantId,
  plantCode,
  genus,
  currentStatus,
  pests,
  onRecorded,
}: {
  plantId: string;
  plantCode: string;
  genus: string | null;
  currentStatus: HealthStatus;
  pests: Pest[];
  onRecorded?: (outcome: InspectionOutcome) => void;
}) {
  const record = useRecordInspection();
  const [outcome, setOutcome] = useState<InspectionOutcome | null>(null);
  const form = useForm({
    resolver: zodResolver(inspectionCreateSchema),
    defaultValues: { inspectedOn: todayIso(), notes: '', findings: [] },
  });
  const { errors } = form.formState;
  const findings = useFieldArray({ control: form.control, name: 'findings' });
  const watched = useWatch({ control: form.control, name: 'findings' }) ?? [];

  const offered = useMemo(() => [...pestsForGenus(pests, genus)].sort((a, b) => a.name.localeCompare(b.name)), [pests, genus]);
  const byId = useMemo(() => new Map(pests.map((p) => [p.id, p])), [pests]);

  // What the rules would do with what is entered so far, so nobody is surprised by a hold.
  const chosen = watched.map((f) => (f?.pestId ? byId.get(f.pestId) : undefined)).filter((p): p is Pest => Boolean(p));
  const preview = statusAfterInspection(
    currentStatus,
    chosen.map((p) => ({ travelsInWood: p.travelsInWood, severity: 'minor' })),
  );

  const onSubmit = form.handleSubmit(async (values) => {
    setOutcome(null);
    try {
      const result = await record.mutateAsync({ plantId, input: values });
      setOutcome(result);
      form.reset({ inspectedOn: todayIso(), notes: '', findings: [] });
      onRecorded?.(result);
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [name, message] of Object.entries(error.fields)) {
          if (name === 'inspectedOn' || name === 'notes' || /^findings\.\d+\.(pestId|severity|notes)$/.test(name) || name === 'findings') {
            form.setError(name as 'notes', { type: 'server', message });
          }
        }
      }
    }
  });

  const told = outcome ? describeOutcome(outcome) : null;

  return (
    <div className="flex flex-col gap-4">
      {told && outcome ? (
        <Alert tone={outcome.statusAfter === 'clean' ? 'success' : 'warning'} title={told.title}>
          <div className="flex flex-col items-start gap-2">
            <StatusBadge status={outcome.statusAfter} />
            {told.body ? <p>{told.body}</p> : null}
          </div>
        </Alert>
      ) : null}
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label={`Record an inspection of ${plantCode}`}>
        {record.isError ? <Alert tone="danger">{errorMessage(record.error)}</Alert> : null}
        <div className="grid gap-4 sm:grid-cols-[14rem_1fr]">
          <Field label="Date inspected" error={named('Date inspected', errors.inspectedOn?.message)}>
            <TextInput type="date" max={todayIso()} {...form.register('inspectedOn')} />
          </Field>
        </div>

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-base font-semibold">Findings</legend>
          {findings.fields.length === 0 ? (
            <p className="text-ink-soft">No findings: the plant will be recorded as clean. Add a finding for each pest or disease you saw.</p>
          ) : null}
          {errors.findings?.message ? <p className="font-medium text-rust">{named('Findings', errors.findings.message)}</p> : null}
          {findings.fields.map((row, index) => {
            const rowErrors = errors.findings?.[index];
            const pest = watched[index]?.pestId ? byId.get(watched[index].pestId) : undefined;
            return (
              <fieldset key={row.id} className="rounded-lg border-2 border-paper-edge bg-white/70 p-4" data-testid="finding-row">
                <legend className="px-1 font-semibold">Finding {index + 1}</legend>
                <div className="grid gap-4 md:grid-cols-[2fr_1fr]">
                  <Field label="Pest or disease" error={findingError(rowErrors?.pestId, 'Pest or disease', 'choose one from the list')}>
                    <Select {...form.register(`findings.${index}.pestId`)}>
                      <option value="">Choose…</option>
                      {offered.map((p) => (
                        <option key={p.id} value={p.id}>
                          {p.name}
                          {p.travelsInWood ? ' (travels in cutting wood)' : ''}
                        </option>
                      ))}
                    </Select>
                  </Field>
                  <Field label="Severity" error={findingError(rowErrors?.severity, 'Severity', 'choose minor, moderate or severe')}>
                    <Select {...form.register(`findings.${index}.severity`)}>
                      <option value="">Choose…</option>
                      {SEVERITIES.map((s) => (
                        <option key={s} value={s}>
                          {SEVERITY_LABELS[s]}
                        </option>
                      ))}
                    </Select>
                  </Field>
                </div>
                {pest ? (
                  <div className="mt-3 flex flex-col gap-1 text-sm">
                    {pest.travelsInWood ? <TravelsInWoodMark className="self-start" /> : null}
                    {pest.signs ? (
                      <p className="text-ink-soft">
                        <span className="font-semibold text-ink">Signs: </span>
                        {pest.signs}
                      </p>
                    ) : null}
                  </div>
                ) : null}
                <Field className="mt-4" label="Notes on this finding" optional error={named('Notes on this finding', rowErrors?.notes?.message)}>
                  <TextArea rows={2} {...form.register(`findings.${index}.notes`)} />
                </Field>
                <Button variant="quiet" size="sm" className="mt-3 text-rust" onClick={() => findings.remove(index)}>
                  Remove finding {index + 1}
                </Button>
              </fieldset>
            );
          })}
          <div>
            <Button
              variant="secondary"
              disabled={findings.fields.length >= MAX_FINDINGS}
              onClick={() => findings.append({ pestId: '', severity: '' as 'minor', notes: '' })}
            >
              Add a finding
            </Button>
          </div>
        </fieldset>

        <Field label="Notes on the inspection" optional hint="What you checked, the weather, anything the next person should know." error={named('Notes', errors.notes?.message)}>
          <TextArea rows={3} {...form.register('notes')} />
        </Field>

        {chosen.length > 0 && preview.status !== currentStatus ? (
          <p className="flex flex-wrap items-center gap-2 rounded-lg bg-paper-deep px-4 py-3">
            <span>When saved, this plant will be</span>
            <StatusBadge status={preview.status} />
            <span className="text-ink-soft">({preview.rule.toLowerCase()})</span>
          </p>
        ) : null}

        <div>
          <Button type="submit" busy={record.isPending}>
            Save the inspection
          </Button>
        </div>
      </form>
    </div>
  );
}
