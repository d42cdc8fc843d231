import { Link } from 'react-router-dom';
import { Page } from '../../components/ui/page';

export function NotFoundPage() {
  return (
    <Page title="No such screen">
      <p>
        The address does not match a Bumpboard screen. <Link className="font-bold text-harbour underline" to="/">Go to your start screen</Link>.
      </p>
    </Page>
  );
}
