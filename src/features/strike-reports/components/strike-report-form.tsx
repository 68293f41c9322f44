import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { LABELS, TREATMENTS, type Treatment } from '../../../../shared/domain';
import type { z } from 'zod';
import type { StrikeReportCreate, StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextArea, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useFileStrikeReport } from '../api/file-strike-report';
import { REPORT_FIELDS, reportFormSchema, type ReportBundle } from '../lib/forms';
import { numberOrUndefined, todayIso } from '../lib/words';
import { HormoneCaution } from './report-cautions';

export type ReportFormBundle = ReportBundle & { id: string; code: string | null; plannedTreatment: Treatment };

/**
 * "File a strike report" for one collected bundle: cuttings stuck, how many rooted, when they
 * were counted, how they were treated, notes. Checked here with the shared schema and the
 * bundle's own limits; the server checks again and its messages land on the same fields.
 */
export function StrikeReportForm({ bundle, today = todayIso(), onFiled, onChanged }: { bundle: ReportFormBundle; today?: string; onFiled?: (report: StrikeReportView) => void; onChanged?: () => void }) {
  const file = useFileStrikeReport(onChanged);
  const schema = useMemo(() => reportFormSchema(bundle, today), [bundle, today]);
  const defaults = {
    stuck: bundle.unreported > 0 ? bundle.unreported : undefined,
    rooted: undefined,
    assessedOn: today >= bundle.collectedOn ? today : bundle.collectedOn,
    treatment: bundle.plannedTreatment,
    notes: '',
  };
  const form = useForm<StrikeReportCreate, unknown, z.output<typeof schema>>({ resolver: zodResolver(schema), defaultValues: defaults });
  const { errors } = form.formState;
  const treatment = useWatch({ control: form.control, name: 'treatment' });
  const ids = `report-${bundle.id}`;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const report = await file.mutateAsync({ bundleId: bundle.id, input: values });
      form.reset({ ...defaults, stuck: undefined });
      onFiled?.(report);
    } catch (error) {
      applyServerFieldErrors(error, form.setError, REPORT_FIELDS);
    }
  });

  return (
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-label={`Strike report on bundle ${bundle.code ?? ''}`.trim()}>
        {file.isError ? <Alert tone="danger">{errorMessage(file.error)}</Alert> : null}
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label="Cuttings stuck" hint={`Of the ${bundle.unreported} not yet in a report.`} error={namedError('Cuttings stuck', errors.stuck?.message)}>
            <TextInput type="number" inputMode="numeric" min={1} max={bundle.unreported} step={1} {...form.register('stuck', { setValueAs: numberOrUndefined })} />
          </Field>
          <Field label="Rooted" hint="Cuttings with roots or new growth." error={namedError('Rooted', errors.rooted?.message)}>
            <TextInput type="number" inputMode="numeric" min={0} step={1} {...form.register('rooted', { setValueAs: numberOrUndefined })} />
          </Field>
          <Field label="Date assessed" hint="The day you counted them." error={namedError('Date assessed', errors.assessedOn?.message)}>
            <TextInput type="date" min={bundle.collectedOn} max={today} {...form.register('assessedOn')} />
          </Field>
        </div>
        <div className="grid gap-4 sm:grid-cols-3">
          <Field
            label="Treatment"
            hint={`Your request said: ${LABELS.treatment[bundle.plannedTreatment].toLowerCase()}.`}
            error={namedError('Treatment', errors.treatment?.message)}
          >
            <Select {...form.register('treatment')}>
              {TREATMENTS.map((t) => (
                <option key={t} value={t}>
                  {LABELS.treatment[t]}
                </option>
              ))}
            </Select>
          </Field>
          <Field className="sm:col-span-2" label="Notes" optional hint="Where and how they were stuck, weather, losses." error={namedError('Notes', errors.notes?.message)}>
            <TextArea rows={2} {...form.register('notes')} />
          </Field>
        </div>
        {treatment === 'hormone' || treatment === 'both' ? <HormoneCaution id={`${ids}-hormone`} /> : null}
        <div>
          <Button type="submit" busy={file.isPending}>
            File the strike report
          </Button>
        </div>
      </form>
  );
}
