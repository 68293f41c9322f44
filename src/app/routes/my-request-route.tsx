import { useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import type { WoodRequest } from '../../../shared/schemas/seasons';
import { useSeason } from '../../features/seasons/api/get-season';
import { deadlineText } from '../../features/seasons/lib/season-dates';
import { takesRequests } from '../../features/seasons/lib/season-facts';
import { useSpecies } from '../../features/species/api/get-species';
import { useMyRequest } from '../../features/wood-requests/api/get-my-request';
import { RequestForm } from '../../features/wood-requests/components/request-form';
import { RequestSummary } from '../../features/wood-requests/components/request-summary';
import { WithdrawRequest } from '../../features/wood-requests/components/withdraw-request';
import { readIncomingLine } from '../../features/wood-requests/lib/request-lines';
import { Alert } from '../../components/ui/alert';
import { Button, ButtonLink } from '../../components/ui/button';
import { Card, CardTitle } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { errorMessage } from '../../lib/api-client';
import { paths } from '../paths';

export function MyRequestRoute() {
  const { seasonId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const season = useSeason(seasonId);
  const mine = useMyRequest(seasonId);
  const species = useSpecies();
  const [saved, setSaved] = useState<WoodRequest | null>(null);
  // With a saved request the page opens on the summary; the form opens on demand, or at
  // once when the planner has brought a line.
  const [editing, setEditing] = useState<boolean | null>(null);
  // The planner's line is read once, when the page opens.
  const incoming = useMemo(() => readIncomingLine(params), []);

  if (season.isPending || mine.isPending || species.isPending) return <Loading label="Loading your request…" />;
  const failed = season.error ?? mine.error ?? species.error;
  if (failed || !season.data || !mine.data || !species.data) {
    return (
      <Alert tone="danger" title="Your request did not load">
        {errorMessage(failed)} Reload the page to try again.
      </Alert>
    );
  }

  const s = season.data;
  const request = mine.data.request;
  const open = takesRequests(s);
  const editable = request ? request.editable : open;
  const showForm = editing ?? (!request || incoming !== null);

  const onSaved = (r: WoodRequest) => {
    setSaved(r);
    setEditing(false);
    // The planner's line is in the request now; a reload must not add it again.
    if (params.has('speciesId')) setParams({}, { replace: true });
    window.scrollTo({ top: 0, behavior: 'smooth' });
  };

  return (
    <>
      <title>{`My wood request, ${s.name} · Heelwood`}</title>
      <p className="mb-2">
        <Link to={paths.season(s.id)}>{s.name}</Link>
      </p>
      <PageHeader
        title="My wood request"
        lead={open ? `Requests close ${deadlineText(s)}. ${s.rules.text}` : s.rules.text}
        actions={
          <>
            <ButtonLink variant="secondary" to={paths.planner()}>
              Plan a planting
            </ButtonLink>
            <ButtonLink variant="secondary" to={paths.seasonBoard(s.id)}>
              Wood board
            </ButtonLink>
          </>
        }
      />
      <div className="flex max-w-4xl flex-col gap-6">
        {saved && request && saved.updatedAt === request.updatedAt ? (
          <Alert tone="success" title={request.status === 'filed' ? 'Your request is filed' : request.status === 'draft' ? 'Saved as a draft' : 'Request withdrawn'}>
            {request.status === 'filed'
              ? `It goes into the allocation round. You can change it until ${deadlineText(s)}.`
              : request.status === 'draft'
                ? 'A draft is not matched to any wood. File it before the deadline.'
                : null}
          </Alert>
        ) : null}
        {request ? <RequestSummary request={request} /> : null}
        {editable && !showForm ? (
          <div className="flex flex-wrap gap-3">
            <Button onClick={() => setEditing(true)}>Change the request</Button>
            {request && request.status !== 'withdrawn' ? <WithdrawRequest seasonId={s.id} /> : null}
          </div>
        ) : editable ? (
          <Card>
            <CardTitle className="text-xl">{request ? 'Change your request' : 'Ask for wood'}</CardTitle>
            <RequestForm seasonId={s.id} request={request} species={species.data.items} incoming={incoming} onSaved={onSaved} />
          </Card>
        ) : (
          <Alert tone="info" title="Requests cannot change now">
            {s.rules.text} {request ? '' : 'You have no request in this season.'}
          </Alert>
        )}
        {request && editable && showForm && request.status !== 'withdrawn' ? (
          <div>
            <WithdrawRequest seasonId={s.id} />
          </div>
        ) : null}
      </div>
    </>
  );
}
