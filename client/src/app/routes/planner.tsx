import { ComingNext, Page } from '../../components/ui/page';

export default function PlannerPage() {
  return (
    <Page title="Planner" subtitle="How far to overbook a route or a future flight.">
      <ComingNext what="the booking-limit curve." />
    </Page>
  );
}
