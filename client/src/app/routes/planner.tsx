import { useQuery } from '@tanstack/react-query';
import { Page } from '../../components/ui/page';
import { PlannerScreen } from '../../features/planner/components/planner-screen';
import { stationsQueryOptions } from '../../features/stations/api/stations';
import { useCurrentStation } from '../use-current-station';

export default function PlannerPage() {
  const { station: current } = useCurrentStation();
  const { data, isPending, error } = useQuery(stationsQueryOptions());
  if (!current) return <Page title="Planner"><p>You do not belong to a station yet. Ask an admin to add you to one.</p></Page>;
  if (isPending) return <Page title="Planner"><p className="text-ink-soft">Loading the station…</p></Page>;
  if (error) return <Page title="Planner"><p role="alert" className="text-alert">{error.message}</p></Page>;
  const station = data.stations.find((s) => s.id === current.id);
  if (!station) return <Page title="Planner"><p role="alert" className="text-alert">Station {current.iata} was not found.</p></Page>;
  // A new station starts a clean plan: figures of one station's route mean nothing for another's.
  return <PlannerScreen key={station.id} station={station} />;
}
