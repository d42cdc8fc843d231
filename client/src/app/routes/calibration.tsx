import { useQuery } from '@tanstack/react-query';
import { Page } from '../../components/ui/page';
import { CalibrationScreen } from '../../features/calibration/components/calibration-screen';
import { sessionQueryOptions } from '../../lib/session';
import { useCurrentStation } from '../use-current-station';

export default function CalibrationPage() {
  const { station } = useCurrentStation();
  const { data } = useQuery(sessionQueryOptions());
  if (!station) return <Page title="Calibration"><p>You do not belong to a station yet. Ask an admin to add you to one.</p></Page>;
  return <CalibrationScreen key={station.id} station={station} isAdmin={data?.user?.role === 'admin'} />;
}
