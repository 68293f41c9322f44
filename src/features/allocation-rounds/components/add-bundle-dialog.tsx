import { useMemo, useState } from 'react';
import type { RoundLine } from '../../../../shared/schemas/allocation';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Field, Select, TextInput } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useAddBundle } from '../api/add-bundle';
import { useFarmChoices } from '../api/get-farm-choices';
import { useFarmOffers } from '../api/get-farm-offers';
import { count, offerChoices, woodName } from '../lib/round-facts';
import { useRoundContext } from './round-context';

function AddBundleForm({ line, onDone }: { line: RoundLine; onDone: () => void }) {
  const { round } = useRoundContext();
  const farms = useFarmChoices();
  const add = useAddBundle();
  const inRound = useMemo(() => new Set(round.bundles.map((b) => b.farmId)), [round.bundles]);
  const [farmId, setFarmId] = useState<string>('');
  const offers = useFarmOffers(round.seasonId, farmId || null);
  const choices = useMemo(() => (offers.data ? offerChoices(line, offers.data.items, round.bundles) : []), [offers.data, line, round.bundles]);
  const [offerId, setOfferId] = useState<string>('');
  const [cuttings, setCuttings] = useState<string>('');
  const chosen = choices.find((c) => c.offerId === offerId) ?? null;
  const missing = line.asked - line.allocated;

  const sorted = useMemo(() => [...(farms.data?.items ?? [])].sort((a, b) => a.name.localeCompare(b.name)), [farms.data]);
  const used = sorted.filter((f) => inRound.has(f.id));
  const others = sorted.filter((f) => !inRound.has(f.id));

  const fields = add.error && isApiError(add.error) ? add.error.fields : {};
  const n = Number(cuttings);
  const valid = chosen !== null && Number.isInteger(n) && n >= 1;

  const submit = async () => {
    if (!valid || !chosen) return;
    try {
      await add.mutateAsync({ roundId: round.id, offerId: chosen.offerId, lineId: line.lineId, cuttings: n });
      onDone();
    } catch {
      // Shown below from the mutation's error.
    }
  };

  return (
    <form
      className="flex flex-col gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
    >
      <p className="rounded-lg bg-paper-deep px-4 py-3">
        <span className="font-semibold">{line.growerName}</span> asks for {count(line.asked)} cuttings of {woodName(line.speciesName, line.varietyName)} and gets{' '}
        {count(line.allocated)}. The server checks the plant's health, the distance ({line.maxDistanceKm} km at most) and the free wood.
      </p>
      <Field label="Farm" error={fields.farmId}>
        <Select
          value={farmId}
          onChange={(e) => {
            add.reset();
            setFarmId(e.target.value);
            setOfferId('');
          }}
        >
          <option value="">{farms.isPending ? 'Loading farms…' : 'Choose a farm'}</option>
          {used.length ? (
            <optgroup label="Farms already giving in this round">
              {used.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.name}
                </option>
              ))}
            </optgroup>
          ) : null}
          <optgroup label={used.length ? 'Other farms' : 'Farms'}>
            {others.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name}
              </option>
            ))}
          </optgroup>
        </Select>
      </Field>
      {farms.isError ? <Alert tone="danger">The farms did not load: {errorMessage(farms.error)}</Alert> : null}
      {farmId ? (
        offers.isPending ? (
          <Loading label="Loading the farm's offers…" />
        ) : offers.isError ? (
          <Alert tone="danger">The offers did not load: {errorMessage(offers.error)}</Alert>
        ) : choices.length === 0 ? (
          <Alert tone="info">No wood at this farm fits the line (same variety, or the species where any variety will do) with cuttings still free.</Alert>
        ) : (
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 font-medium">Plant to take the wood from</legend>
            {choices.map((c) => (
              <label key={c.offerId} className="flex min-h-touch cursor-pointer items-center gap-3 rounded-lg border-2 border-paper-edge bg-white px-3 py-2 has-[:checked]:border-leaf">
                <input
                  type="radio"
                  name="offer"
                  value={c.offerId}
                  checked={offerId === c.offerId}
                  className="h-5 w-5 accent-leaf"
                  onChange={() => {
                    add.reset();
                    setOfferId(c.offerId);
                    setCuttings(String(Math.max(1, Math.min(c.free, missing))));
                  }}
                />
                <span>
                  <span className="font-mono font-semibold">{c.plantCode}</span> · {woodName(c.speciesName, c.varietyName)} ·{' '}
                  <span className="tabular-nums">{count(c.free)} free</span>
                </span>
              </label>
            ))}
            {fields.offerId ? <p className="text-sm font-medium text-rust">Plant: {fields.offerId}</p> : null}
          </fieldset>
        )
      ) : null}
      {chosen ? (
        <Field label="Cuttings" hint={`At most ${count(Math.min(chosen.free, missing))}: what the plant has free and what the line still lacks.`} error={fields.cuttings ? `Cuttings: ${fields.cuttings}` : undefined}>
          <TextInput type="number" inputMode="numeric" min={1} step={1} value={cuttings} onChange={(e) => setCuttings(e.target.value)} className="w-32" />
        </Field>
      ) : null}
      {add.isError ? <Alert tone="danger">{errorMessage(add.error)}</Alert> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={!valid} busy={add.isPending}>
          Add the bundle
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** Adds wood to a request line by hand; the new bundle is locked, so a re-run keeps it. */
export function AddBundleDialog({ line, onClose }: { line: RoundLine | null; onClose: () => void }) {
  return (
    <Dialog open={line !== null} onClose={onClose} title="Add a bundle">
      {line ? <AddBundleForm key={line.lineId} line={line} onDone={onClose} /> : null}
    </Dialog>
  );
}
