import { Link } from 'react-router-dom';
import { LABELS } from '../../../../shared/domain';
import type { PlantDetail } from '../../../../shared/schemas/register';
import { paths } from '../../../app/paths';
import { Alert } from '../../../components/ui/alert';
import { ButtonLink } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { Loading } from '../../../components/ui/loading';
import { StatusBadge } from '../../../components/ui/status-badge';
import { errorMessage } from '../../../lib/api-client';
import { formatDay } from '../../../lib/format';
import { usePests } from '../api/get-pests';
import { AuditLog } from './audit-log';
import { InspectionForm } from './inspection-form';
import { InspectionHistory } from './inspection-history';
import { PlantActions } from './plant-actions';
import type { FarmOption } from './plant-filters';
import { PlantPhotos } from './plant-photos';
import { WoodHistory } from './wood-history';
import { formatPosition, PROVENANCE_LABELS } from './words';

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[9rem_1fr] gap-3 py-2 sm:grid-cols-[11rem_1fr]">
      <dt className="font-medium text-ink-soft">{label}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

const none = <span className="text-ink-faint">Not given</span>;

/** The genus decides which pests can occur; the species list knows it, the name says it too. */
export function genusOf(plant: Pick<PlantDetail, 'scientificName'>, fromSpecies?: string | null): string | null {
  return fromSpecies ?? (plant.scientificName.trim().split(/\s+/)[0] || null);
}

function StatusNotice({ plant }: { plant: PlantDetail }) {
  if (plant.healthStatus === 'hold') {
    return (
      <Alert tone="warning" title="On hold">
        No wood is taken or offered from this plant. Only a coordinator lifts a hold, once the finding is dealt with.
      </Alert>
    );
  }
  if (plant.healthStatus === 'watch') {
    return <Alert tone="info" title="On watch">A finding that does not travel in wood was recorded. Wood is offered only from clean plants.</Alert>;
  }
  if (plant.healthStatus === 'retired') {
    return (
      <Alert tone="info" title="Retired">
        {plant.retiredAt ? `Retired on ${formatDay(plant.retiredAt)}. ` : ''}The record stays as history; the plant is no longer inspected and gives no wood.
      </Alert>
    );
  }
  return null;
}

export function PlantPage({
  plant,
  genus,
  farms,
  coordinator = false,
}: {
  plant: PlantDetail;
  genus: string | null;
  farms: FarmOption[];
  /** Coordinators follow a finding that travels in wood to the wood it may be in. */
  coordinator?: boolean;
}) {
  const pests = usePests();
  const position = formatPosition(plant.lat, plant.lon);
  const farmName = (id: string) => farms.find((farm) => farm.id === id)?.name;

  return (
    <div className="flex flex-col gap-5">
      <title>{`${plant.code} · Heelwood`}</title>
      <header className="flex flex-col gap-3">
        <p className="print:hidden">
          <Link to={paths.plants()}>All plants</Link>
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-3xl font-bold tracking-tight sm:text-4xl">{plant.code}</h1>
          <StatusBadge status={plant.healthStatus} className="text-base" />
        </div>
        <p className="text-lg text-ink-soft">
          {plant.varietyName ? <span className="font-semibold text-ink">{plant.varietyName} · </span> : null}
          {plant.speciesName} (<i>{plant.scientificName}</i>) · {plant.farmName}
        </p>
        <div className="flex flex-wrap gap-2">
          <PlantActions plant={plant} farms={farms} />
          <ButtonLink variant="secondary" to={paths.plantTrace(plant.id)}>
            Trace
          </ButtonLink>
          {coordinator && plant.healthStatus === 'hold' ? (
            <ButtonLink variant="secondary" to={paths.plantExposure(plant.id)}>
              Exposure and notices
            </ButtonLink>
          ) : null}
        </div>
      </header>

      <StatusNotice plant={plant} />
      {!plant.full ? (
        <Alert tone="info" title="Another farm's plant">
          You see the shared part of its record. The position is rounded to about 1 km; inspections, notes and photos stay with the farm and the coordinators.
        </Alert>
      ) : null}
      {plant.restrictionNote ? (
        <Alert tone="warning" title="Plant-health caution for this species">
          <p>{plant.restrictionNote}</p>
          <p className="mt-1 text-sm text-ink-soft">Heelwood advises and records; it does not certify plant health or permit any movement of plants.</p>
        </Alert>
      ) : null}

      <div className="grid items-start gap-5 lg:grid-cols-[3fr_2fr]">
        <div className="flex min-w-0 flex-col gap-5">
          <Card>
            <CardTitle>About this plant</CardTitle>
            <dl className="divide-y divide-paper-edge">
              <Row label="Species">
                {plant.speciesName} <span className="italic text-ink-soft">{plant.scientificName}</span>
              </Row>
              <Row label="Variety">{plant.varietyName ?? none}</Row>
              <Row label="Farm">
                {plant.farmName} ({plant.farmCode})
              </Row>
              <Row label="Planting year">{plant.plantingYear}</Row>
              <Row label="Role">{LABELS.plantRole[plant.role]}</Row>
              <Row label="Last inspected">{plant.lastInspectedOn ? formatDay(plant.lastInspectedOn) : 'Never'}</Row>
              {plant.full ? <Row label="Notes">{plant.notes ? <span className="whitespace-pre-wrap">{plant.notes}</span> : none}</Row> : null}
              <Row label="In the register since">{formatDay(plant.createdAt)}</Row>
            </dl>
          </Card>

          {plant.can.inspect ? (
            <Card tone="emphasis">
              <CardTitle>Record an inspection</CardTitle>
              {pests.isPending ? (
                <Loading label="Loading the pest and disease list…" />
              ) : pests.isError ? (
                <Alert tone="danger">The pest and disease list did not load: {errorMessage(pests.error)}</Alert>
              ) : (
                <InspectionForm plantId={plant.id} plantCode={plant.code} genus={genus} currentStatus={plant.healthStatus} pests={pests.data.items} />
              )}
            </Card>
          ) : null}

          {plant.full ? (
            <Card>
              <CardTitle>Inspections</CardTitle>
              <InspectionHistory
                inspections={plant.inspections}
                canInspect={plant.can.inspect}
                exposureHref={coordinator ? (findingId) => paths.plantExposure(plant.id, findingId) : undefined}
              />
            </Card>
          ) : null}

          <Card>
            <CardTitle>Photos</CardTitle>
            <PlantPhotos plantId={plant.id} plantCode={plant.code} photos={plant.photos} canEdit={plant.can.edit} hasPosition={position !== null} />
          </Card>
        </div>

        <div className="flex min-w-0 flex-col gap-5">
          <Card>
            <CardTitle>Position</CardTitle>
            <dl className="divide-y divide-paper-edge">
              <Row label="Latitude, longitude">
                {position ? (
                  <span className="font-mono text-[0.95em]">
                    {position}
                    {!plant.full ? <span className="block font-sans text-sm text-ink-soft">rounded to about 1 km</span> : null}
                  </span>
                ) : (
                  <span className="text-ink-faint">Not placed yet</span>
                )}
              </Row>
              {plant.full ? <Row label="Bed / row">{plant.bedRow || none}</Row> : null}
            </dl>
            {!position && plant.can.edit ? (
              <p className="mt-2 text-sm text-ink-soft">
                Set it in <Link to={paths.plantEdit(plant.id)}>Edit</Link> (typed, from your phone's position or a photo), or from a photo below.
              </p>
            ) : null}
          </Card>

          <Card>
            <CardTitle>Where it came from</CardTitle>
            <dl className="divide-y divide-paper-edge">
              <Row label="Provenance">{PROVENANCE_LABELS[plant.provenance]}</Row>
              {plant.provenance === 'bought' && plant.full ? <Row label="Supplier">{plant.supplier || none}</Row> : null}
              {plant.parent ? (
                <Row label="Parent plant">
                  <Link to={paths.plant(plant.parent.id)}>{plant.parent.code}</Link>
                </Row>
              ) : null}
              {plant.sourceBundle ? (
                <Row label="From bundle">
                  {plant.sourceBundle.code ?? 'no code'} <span className="text-ink-soft">({plant.sourceBundle.seasonName})</span>
                </Row>
              ) : null}
            </dl>
            <p className="mt-3">
              <Link to={paths.plantTrace(plant.id)}>Trace its whole lineage</Link>
              <span className="text-ink-soft"> — ancestors, every plant raised from its wood, and the bundles between them</span>
            </p>
            <h3 className="mt-4 font-semibold">Raised from this plant</h3>
            {plant.children.length === 0 ? (
              <p className="text-ink-soft">No registered plant names this one as its parent yet.</p>
            ) : (
              <ul className="mt-1 flex flex-col gap-1">
                {plant.children.map((child) => (
                  <li key={child.id}>
                    <Link to={paths.plant(child.id)}>{child.code}</Link> <span className="text-ink-soft">at {child.farmName}</span>
                  </li>
                ))}
              </ul>
            )}
          </Card>

          {plant.full ? (
            <Card>
              <CardTitle>Wood given</CardTitle>
              <WoodHistory items={plant.woodHistory} />
            </Card>
          ) : null}

          {plant.full ? (
            <Card>
              <CardTitle>Changes</CardTitle>
              <AuditLog items={plant.audit} farmName={farmName} />
            </Card>
          ) : null}
        </div>
      </div>
    </div>
  );
}
