import { useState } from 'react';
import type { Species, Variety } from '../../../../shared/schemas/register';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { plural } from '../../../lib/format';
import { SpeciesForm } from './species-form';
import { VarietyForm } from './variety-form';
import { METHOD_LABELS, percent } from './words';

function Facts({ species }: { species: Species }) {
  const facts: Array<[string, string]> = [
    ['Propagation', species.propagationMethods.map((m) => METHOD_LABELS[m]).join(', ')],
    ['Cutting', `${species.defaultCuttingLengthCm} cm long, ${species.defaultCuttingDiameterMm} mm thick; ${species.softTipCm} cm soft tip discarded`],
    ['Reference strike rate', `${percent(species.strikeRatePrior)}, until strike reports refine it`],
    ['First crop', `after about ${plural(species.firstCropYears, 'year')}`],
    ['Part shade', species.shadeTolerant ? 'Grows in part shade' : 'Wants full sun'],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[11rem_1fr]">
      {facts.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="font-medium text-ink-soft">{label}</dt>
          <dd className="mb-1 sm:mb-0">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function VarietyList({ species, canEdit }: { species: Species; canEdit: boolean }) {
  const [editing, setEditing] = useState<Variety | 'new' | null>(null);
  return (
    <div className="mt-4">
      <h3 className="mb-2 font-semibold">Varieties ({species.varieties.length})</h3>
      {species.varieties.length === 0 ? (
        <p className="text-ink-soft">{canEdit ? 'No varieties yet. Add the varieties member farms grow.' : 'No varieties listed yet.'}</p>
      ) : (
        <ul className="flex flex-col divide-y divide-paper-edge">
          {species.varieties.map((variety) =>
            editing !== 'new' && editing?.id === variety.id ? (
              <li key={variety.id} className="py-2">
                <VarietyForm speciesId={species.id} speciesName={species.commonName} variety={variety} onDone={() => setEditing(null)} />
              </li>
            ) : (
              <li key={variety.id} className="flex flex-wrap items-start justify-between gap-2 py-2">
                <div>
                  <p className="font-medium">{variety.name}</p>
                  {variety.description ? <p className="text-sm text-ink-soft">{variety.description}</p> : null}
                </div>
                <div className="flex items-center gap-2">
                  <span className="text-sm text-ink-soft">{plural(variety.plantCount, 'plant')}</span>
                  {canEdit ? (
                    <Button size="sm" variant="quiet" onClick={() => setEditing(variety)} aria-label={`Edit ${variety.name}`}>
                      Edit
                    </Button>
                  ) : null}
                </div>
              </li>
            ),
          )}
        </ul>
      )}
      {canEdit ? (
        editing === 'new' ? (
          <div className="mt-3">
            <VarietyForm speciesId={species.id} speciesName={species.commonName} onDone={() => setEditing(null)} />
          </div>
        ) : (
          <Button size="sm" variant="secondary" className="mt-3" onClick={() => setEditing('new')}>
            Add a variety
          </Button>
        )
      ) : null}
    </div>
  );
}

export function SpeciesList({ species, canEdit }: { species: Species[]; canEdit: boolean }) {
  const [editing, setEditing] = useState<string | 'new' | null>(null);

  return (
    <div className="flex flex-col gap-5">
      {canEdit ? (
        editing === 'new' ? (
          <Card tone="emphasis">
            <h2 className="mb-4 text-lg font-semibold">New species</h2>
            <SpeciesForm onDone={() => setEditing(null)} />
          </Card>
        ) : (
          <div>
            <Button onClick={() => setEditing('new')}>Add a species</Button>
          </div>
        )
      ) : null}

      {species.length === 0 ? (
        <EmptyState title="No species listed yet">
          {canEdit ? 'Add the species member farms keep, then their varieties. Farms choose from this list when they register a plant.' : 'A coordinator adds the species and varieties; they appear here.'}
        </EmptyState>
      ) : null}

      {species.length > 3 ? (
        <nav aria-label="Species on this page" className="rounded-card border border-paper-edge bg-white/60 p-4">
          <p className="mb-2 font-semibold">Jump to</p>
          <ul className="flex flex-wrap gap-x-1 gap-y-1">
            {species.map((s) => (
              <li key={s.id}>
                <a href={`#species-${s.id}`} className="inline-flex min-h-touch items-center rounded px-2">
                  {s.commonName}
                </a>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}

      <ul className="flex flex-col gap-5">
        {species.map((s) => (
          <li key={s.id}>
            <Card as="article" aria-labelledby={`species-${s.id}`}>
              {editing === s.id ? (
                <>
                  <h2 id={`species-${s.id}`} className="mb-4 text-lg font-semibold">
                    Edit {s.commonName}
                  </h2>
                  <SpeciesForm species={s} onDone={() => setEditing(null)} />
                </>
              ) : (
                <>
                  <div className="mb-3 flex flex-wrap items-start justify-between gap-3">
                    <div>
                      <h2 id={`species-${s.id}`} className="text-xl font-semibold">
                        {s.commonName}
                      </h2>
                      <p className="italic text-ink-soft">
                        {s.scientificName} <span className="not-italic">· genus {s.genus}</span>
                      </p>
                    </div>
                    {canEdit ? (
                      <Button size="sm" variant="secondary" onClick={() => setEditing(s.id)} aria-label={`Edit ${s.commonName}`}>
                        Edit species
                      </Button>
                    ) : null}
                  </div>
                  <Facts species={s} />
                  {s.restrictionNote ? (
                    <Alert tone="warning" title="Plant-health caution" className="mt-4">
                      {s.restrictionNote}
                    </Alert>
                  ) : null}
                  {s.notes ? <p className="mt-3 text-ink-soft">{s.notes}</p> : null}
                  <VarietyList species={s} canEdit={canEdit} />
                </>
              )}
            </Card>
          </li>
        ))}
      </ul>
    </div>
  );
}
