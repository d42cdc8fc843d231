import { useParams } from 'react-router-dom';
import { Page } from '../../components/ui/page';
import { BumpReview } from '../../features/denials/components/bump-review';

export default function BumpReviewPage() {
  const { flightId } = useParams();
  const id = Number(flightId);
  if (!Number.isInteger(id) || id <= 0) {
    return (
      <Page title="Bump review">
        <p role="alert">“{flightId}” is not a flight this screen knows. Open a flight from Departures.</p>
      </Page>
    );
  }
  return <BumpReview key={id} flightId={id} />;
}
