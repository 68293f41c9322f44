import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { LABELS } from '../../../../shared/domain';
import type { OfferRow } from '../../../../shared/schemas/seasons';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, namedError, Select, TextInput } from '../../../components/ui/field';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { useSetOffer } from '../api/set-offer';
import { useWithdrawOffer } from '../api/withdraw-offer';
import { checkOffer, defaultOfferValues, offerResolver, type OfferFormValues, type OfferMode } from '../lib/offer-form';

const percent = (fraction: number) => `${Math.round(fraction * 1000) / 10} %`;

/**
 * One plant's offer: shoot count and mean length (or a direct count), the estimate and cap
 * worked out as the person types, and the number offered (the cap unless they give less).
 */
export function OfferRowEditor({ seasonId, row, canChange }: { seasonId: string; row: OfferRow; canChange: boolean }) {
  const id = useId();
  const save = useSetOffer();
  const withdraw = useWithdrawOffer();
  const [confirmWithdraw, setConfirmWithdraw] = useState(false);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const form = useForm<OfferFormValues>({ defaultValues: defaultOfferValues(row), resolver: offerResolver(row), mode: 'onChange' });
  const values = useWatch({ control: form.control }) as OfferFormValues;
  const { errors, isDirty } = form.formState;
  const live = checkOffer(row, values);
  const offer = row.offer;

  const onSubmit = form.handleSubmit(async (v) => {
    setSavedNote(null);
    try {
      const saved = await save.mutateAsync({ seasonId, plantId: row.plantId, input: checkOffer(row, v).body });
      setSavedNote(`Saved: ${saved.offer.offered} cuttings offered (estimate ${saved.offer.estimatedYield}, at most ${saved.max}).`);
      form.reset({ ...v, offered: String(saved.offer.offered) });
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['shootCount', 'meanShootLengthCm', 'directCount', 'offered']);
    }
  });

  const onWithdraw = async () => {
    try {
      await withdraw.mutateAsync({ seasonId, plantId: row.plantId });
      setConfirmWithdraw(false);
      setSavedNote(null);
    } catch {
      // Shown in the dialog.
    }
  };

  const label = row.varietyName ? `${row.code}, ${row.varietyName}` : row.code;
  const disabled = !canChange;

  return (
    <form onSubmit={onSubmit} noValidate aria-labelledby={`${id}-title`} className="grid gap-3 py-5 lg:grid-cols-[12rem_minmax(0,1fr)] lg:gap-x-6">
      <div className="flex flex-col gap-1">
        <h4 id={`${id}-title`} className="text-lg font-semibold">
          {row.code}
          <span className="sr-only"> ({label})</span>
        </h4>
        <p className="text-sm text-ink-soft">
          {LABELS.plantRole[row.role]}, up to {percent(row.capFraction)} of its yield
        </p>
        {offer ? (
          <p className="text-sm">
            <span className="font-semibold">On offer: {offer.offered}</span> of {offer.estimatedYield}
            {offer.reserved > 0 ? <span className="block font-semibold text-currant">{offer.reserved} already reserved</span> : null}
          </p>
        ) : (
          <p className="text-sm font-medium text-ink-soft">Not offered yet</p>
        )}
      </div>
      <div className="flex flex-col gap-3">
        <div className="grid grid-cols-2 gap-3 xl:grid-cols-[12rem_1fr_1fr_1fr]">
          <Field label="Measured by" className="order-1">
            <Select
              disabled={disabled}
              value={values.mode}
              onChange={(event) => form.setValue('mode', event.target.value as OfferMode, { shouldDirty: true, shouldValidate: form.formState.isSubmitted })}
            >
              <option value="shoots">Shoots</option>
              <option value="direct">Cuttings</option>
            </Select>
          </Field>
          {values.mode === 'shoots' ? (
            <>
              <Field label="New shoots" className="order-3 xl:order-2" error={namedError('Shoot count', errors.shootCount?.message)}>
                <TextInput type="number" inputMode="numeric" min={0} step={1} disabled={disabled} {...form.register('shootCount')} />
              </Field>
              <Field label="Mean length (cm)" className="order-4 xl:order-3" error={namedError('Mean shoot length', errors.meanShootLengthCm?.message)}>
                <TextInput type="number" inputMode="decimal" min={0} step="any" disabled={disabled} {...form.register('meanShootLengthCm')} />
              </Field>
            </>
          ) : (
            <Field label="Cuttings counted" className="order-3 col-span-2 xl:order-2" error={namedError('Cuttings counted', errors.directCount?.message)}>
              <TextInput type="number" inputMode="numeric" min={0} step={1} disabled={disabled} {...form.register('directCount')} />
            </Field>
          )}
          <Field label="Cuttings offered" className="order-2 xl:order-4" error={namedError('Cuttings offered', errors.offered?.message)}>
            <TextInput type="number" inputMode="numeric" min={0} step={1} placeholder={live.estimate ? `all ${live.estimate.cap}` : ''} disabled={disabled} {...form.register('offered')} />
          </Field>
        </div>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          <div aria-live="polite" className="min-h-touch flex-1 rounded-lg bg-paper-deep px-4 py-2.5" data-testid="offer-estimate">
            {live.estimate ? (
              <p>
                Estimate <strong>{live.estimate.estimatedYield}</strong> cuttings · may offer up to <strong>{live.estimate.cap}</strong>
                <span className="text-ink-soft"> (leave “Cuttings offered” empty for all of them)</span>
              </p>
            ) : (
              <p className="text-ink-soft">{values.mode === 'shoots' ? 'Enter the shoots and their mean length to see the estimate.' : 'Enter the cuttings counted to see what may be offered.'}</p>
            )}
          </div>
          {canChange ? (
            <div className="flex flex-wrap items-center gap-2">
              <Button type="submit" busy={save.isPending}>
                {offer ? 'Save offer' : 'Offer this wood'}
              </Button>
              {offer ? (
                <Button
                  variant="secondary"
                  onClick={() => {
                    withdraw.reset();
                    setConfirmWithdraw(true);
                  }}
                >
                  Withdraw
                </Button>
              ) : null}
            </div>
          ) : null}
        </div>
        {isDirty && canChange ? <p className="text-sm font-medium text-amber">Changed, not saved yet.</p> : null}
        {save.isError && !Object.keys(errors).length ? <Alert tone="danger">{errorMessage(save.error)}</Alert> : null}
        {savedNote && !isDirty ? <Alert tone="success">{savedNote}</Alert> : null}
      </div>
      <Dialog open={confirmWithdraw} onClose={() => setConfirmWithdraw(false)} title={`Withdraw the offer from ${row.code}?`}>
        <div className="flex flex-col gap-4">
          <p>Its {offer?.offered ?? 0} cuttings leave the board. You can offer again while offers are open.</p>
          {withdraw.isError ? <Alert tone="danger">{errorMessage(withdraw.error)}</Alert> : null}
          <div className="flex flex-wrap gap-3">
            <Button variant="danger" onClick={onWithdraw} busy={withdraw.isPending}>
              Yes, withdraw
            </Button>
            <Button variant="secondary" onClick={() => setConfirmWithdraw(false)}>
              Keep the offer
            </Button>
          </div>
        </div>
      </Dialog>
    </form>
  );
}
