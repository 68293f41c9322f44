import { Link } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { paths } from '../paths';
import { PublicPage } from '../shell/public-layout';

export function ApplicationReceivedRoute() {
  return (
    <PublicPage title="Application received">
      <div className="flex flex-col gap-5">
        <Alert tone="success">Thank you. Your application has reached the cooperative.</Alert>
        <p>
          A coordinator will read it and admit you. Until then you can sign in, but Heelwood shows only a page saying your
          application is waiting.
        </p>
        <p>
          <Link to={paths.signIn()}>Go to sign in</Link>
        </p>
      </div>
    </PublicPage>
  );
}
