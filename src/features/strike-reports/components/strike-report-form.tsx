import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { LABELS, TREATMENTS, type Treatment } from '../../../../shared/domain';
import type { z } from 'zod';
import type { StrikeReportCreate, StrikeReportView } from '../../../../shared/schemas/strike-reports';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, namedError, Select, TextArea, TextInput } from '../../../components/ui/field';
import { ApiError, errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useFileStrikeReport } from '../api/file-strike-report';
import { MAX_PHOTO_BYTES, PHOTO_TYPES, useUploadReportPhoto } from '../api/upload-report-photo';
import { REPORT_FIELDS, reportFormSchema, type ReportBundle } from '../lib/forms';
import { numberOrUndefined, todayIso } from '../lib/words';
import { HormoneCaution } from './report-cautions';

export type ReportFormBundle = ReportBundle & { id: string; code: string | null; plannedTreatment: Treatment };

const PHOTO_LABEL = 'Photo of the rooted cuttings';

/** What is wrong with a chosen photo before anything is sent (the server checks the bytes again). */
export function photoFileError(file: File): string | undefined {
  if (!PHOTO_TYPES.split(',').includes(file.type)) return `${PHOTO_LABEL}: choose a JPEG, PNG or WebP image`;
  if (file.size > MAX_PHOTO_BYTES) return `${PHOTO_LABEL}: larger than 10 MB; choose a smaller copy`;
  return undefined;
}

function photoUploadError(error: unknown): string {
  const field = error instanceof ApiError ? error.fields.photo : undefined;
  return `${PHOTO_LABEL} not uploaded: ${field ?? errorMessage(error)}`;
}

/**
 * "File a strike report" for one collected bundle: cuttings stuck, how many rooted, when they
 * were counted, how they were treated, notes. Checked here with the shared schema and the
 * bundle's own limits; the server checks again and its messages land on the same fields.
 */
export function StrikeReportForm({ bundle, today = todayIso(), onFiled, onChanged }: { bundle: ReportFormBundle; today?: string; onFiled?: (report: StrikeReportView) => void; onChanged?: () => void }) {
  const file = useFileStrikeReport(onChanged);
  const upload = useUploadReportPhoto();
  const photoRef = useRef<HTMLInputElement>(null);
  const [photoError, setPhotoError] = useState<string | undefined>();
  /** A report filed here whose photo did not upload: the report stays, the photo can be tried again. */
  const [photoPending, setPhotoPending] = useState<{ report: StrikeReportView; file: File } | null>(null);
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

  // Another report filed or removed meanwhile: start from the cuttings now left, unless typed over.
  useEffect(() => {
    if (!form.getFieldState('stuck').isDirty) form.resetField('stuck', { defaultValue: bundle.unreported > 0 ? bundle.unreported : undefined });
  }, [bundle.unreported, form]);

  /** Empties the file input, so that the next report does not carry this one's photo. */
  const clearPhoto = () => {
    if (photoRef.current) photoRef.current.value = '';
  };

  const chosenPhoto = (): { file?: File; error?: string } => {
    const chosen = photoRef.current?.files?.[0];
    return chosen ? { file: chosen, error: photoFileError(chosen) } : {};
  };

  /** Uploads the photo of a filed report; true when it is stored. */
  const sendPhoto = async (report: StrikeReportView, photo: File): Promise<boolean> => {
    try {
      await upload.mutateAsync({ reportId: report.id, file: photo });
      return true;
    } catch (error) {
      setPhotoError(photoUploadError(error));
      setPhotoPending({ report, file: photo });
      return false;
    }
  };

  const onSubmit = form.handleSubmit(async (values) => {
    const photo = chosenPhoto();
    setPhotoError(photo.error);
    // A photo that cannot be sent stops the report here, so it is not filed without it by surprise.
    if (photo.error) return;
    let report: StrikeReportView;
    try {
      report = await file.mutateAsync({ bundleId: bundle.id, input: values });
    } catch (error) {
      applyServerFieldErrors(error, form.setError, REPORT_FIELDS);
      return;
    }
    form.reset({ ...defaults, stuck: undefined });
    if (photo.file && !(await sendPhoto(report, photo.file))) return;
    clearPhoto();
    onFiled?.(report);
  });

  const retryPhoto = async () => {
    if (!photoPending) return;
    // Another photo chosen here replaces the one that failed; otherwise that one is sent again.
    const photo = chosenPhoto();
    if (photo.error) {
      setPhotoError(photo.error);
      return;
    }
    setPhotoError(undefined);
    const { report } = photoPending;
    if (await sendPhoto(report, photo.file ?? photoPending.file)) {
      setPhotoPending(null);
      clearPhoto();
      onFiled?.(report);
    }
  };

  const photoField = (
    <Field label={PHOTO_LABEL} optional hint="JPEG, PNG or WebP, up to 10 MB. Only you and the coordinators see it." error={photoError}>
      <TextInput ref={photoRef} type="file" accept={PHOTO_TYPES} className="py-2" onChange={() => setPhotoError(undefined)} />
    </Field>
  );

  if (photoPending) {
    return (
      <div className="flex flex-col gap-4" role="group" aria-label={`Photo for the strike report on bundle ${bundle.code ?? ''}`.trim()}>
        <Alert tone="warning" title="Strike report filed; the photo is not uploaded yet">
          The report is saved. Try the same photo again, choose another one, or go on without it.
        </Alert>
        {photoField}
        <div className="flex flex-wrap gap-2">
          <Button onClick={retryPhoto} busy={upload.isPending}>
            Try the photo again
          </Button>
          <Button
            variant="secondary"
            onClick={() => {
              const { report } = photoPending;
              setPhotoPending(null);
              setPhotoError(undefined);
              clearPhoto();
              onFiled?.(report);
            }}
          >
            Go on without the photo
          </Button>
        </div>
      </div>
    );
  }

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
        {photoField}
        <div>
          <Button type="submit" busy={file.isPending || upload.isPending}>
            File the strike report
          </Button>
        </div>
      </form>
  );
}
