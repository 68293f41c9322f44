import type { ReactNode } from 'react';
import type { Me } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { ButtonLink } from '../../../components/ui/button';
import { Card, CardTitle } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { FarmList } from './farm-list';
import { SafetyNote } from './safety-note';

function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] || name;
}

function FarmNextSteps({ me }: { me: Me }) {
  const leads = me.farms.some((farm) => farm.farmRole === 'lead');
  return (
    <Card>
      <CardTitle>What to do now</CardTitle>
      <ul className="flex list-disc flex-col gap-2 pl-5">
        <li>
          Check that the farms and roles above are right. If one is missing or wrong, tell your coordinator: only a coordinator
          changes them.
        </li>
        {leads ? (
          <li>
            Register your mother plants: variety, planting year, role and where each one stands (bed and row, or the position from
            your phone). A whole list can come in from a CSV file.
          </li>
        ) : (
          <li>
            Record inspections from your phone in the field: open a plant (or scan the QR code on its label) and choose “Record an
            inspection”.
          </li>
        )}
      </ul>
      <div className="mt-4 flex flex-wrap gap-2">
        <ButtonLink to={paths.plants(new URLSearchParams({ mine: 'true' }))}>{me.farms.length > 1 ? "Your farms' plants" : "Your farm's plants"}</ButtonLink>
        <ButtonLink variant="secondary" to={paths.plantNew()}>
          Add a plant
        </ButtonLink>
      </div>
    </Card>
  );
}

function GrowerOutlook() {
  return (
    <Card>
      <CardTitle>What Heelwood will do for you</CardTitle>
      <p className="mb-3 text-ink-soft">
        Heelwood is how the cooperative shares cutting wood from its members' mother plants. As your coordinator enables each part,
        it appears on this page, and you will be able to:
      </p>
      <ul className="flex list-disc flex-col gap-2 pl-5">
        <li>plan a planting (a hedgerow, shrubs beside orchard trees, a nursery bed) and see how many cuttings to ask for, with an honest estimate of how many will root;</li>
        <li>request wood in a season from member farms within the distance you are willing to travel;</li>
        <li>get a pickup slip by e-mail saying which farm, when, and which bundles to collect;</li>
        <li>report later how many cuttings rooted, which makes everyone's estimates better.</li>
      </ul>
      <p className="mt-3 text-ink-soft">
        There is nothing you need to do yet. If you already keep mother plants on a member farm, ask your coordinator to add you to
        that farm.
      </p>
    </Card>
  );
}

/** Home for an admitted member: their farms, or what is ahead for a grower without one. */
export function MemberHome({ me, season }: { me: Me; /** The season card, composed by the route. */ season?: ReactNode }) {
  const hasFarms = me.farms.length > 0;
  return (
    <div>
      <PageHeader
        title={`Welcome, ${firstName(me.user.name)}`}
        lead={hasFarms ? 'Your farms in the cooperative and what you can do today.' : 'You are a member of the cooperative.'}
      />
      <div className="grid gap-5 lg:grid-cols-[2fr_1fr]">
        <div className="flex flex-col gap-5">
          {season}
          {hasFarms ? (
            <>
              <FarmList farms={me.farms} />
              <FarmNextSteps me={me} />
            </>
          ) : (
            <GrowerOutlook />
          )}
        </div>
        <SafetyNote />
      </div>
    </div>
  );
}
