import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Caution, Page, Panel } from '../../../components/ui/page';
import { stationLearningQueryOptions } from '../api/learning';
import { BacktestPanel } from './backtest-panel';
import { OutcomesPanel } from './outcomes-panel';
import { ReliabilityChart } from './reliability-chart';
import { ScoresTable } from './scores-table';
import { SegmentsTable } from './segments-table';
import { TrainingPanel } from './training-panel';

/** How well the show rates matched what happened, per station and per route, and which rates the forecasts use. */
export function CalibrationScreen({ station, isAdmin }: { station: { id: number; iata: string; name: string }; isAdmin: boolean }) {
  const { data, isPending, error } = useQuery(stationLearningQueryOptions(station.id));
  const [route, setRoute] = useState<string>('');
  const title = `Calibration · ${station.iata}`;
  if (isPending) return <Page title={title}><p className="text-ink-soft">Loading…</p></Page>;
  if (error) return <Page title={title}><p role="alert" className="text-alert">{error.message}</p></Page>;
  const routes = data.calibration.filter((c) => c.route !== null).map((c) => c.route!);
  const shown = data.calibration.find((c) => c.route === (route || null)) ?? data.calibration.find((c) => c.route === null);
  const scope = shown?.route ? `${station.iata}–${shown.route}` : `all of ${station.iata}`;
  return (
    <Page title={title} subtitle={`Show rates learned from ${station.name}'s closed flights, and how well they matched what happened.`}>
      <Caution>
        Learned rates describe past flights. Bumpboard computes what the configured rules and these rates say; the carrier’s
        own staff decide which rates to trust, and the applicable regulation and contract of carriage decide every passenger’s rights.
      </Caution>
      <div className="mt-4 space-y-4">
        <Panel title="Training and the rates in use">
          <TrainingPanel key={`${data.choice.mode}-${data.choice.pinnedVersion}`} learning={data} canChange={isAdmin} />
        </Panel>
        {shown ? (
          <>
            <label className="flex max-w-sm flex-col gap-1 font-bold">
              Show calibration for
              <select className="min-h-11 rounded-md border-2 border-line bg-card px-2" value={route} onChange={(e) => setRoute(e.target.value)}>
                <option value="">The whole station</option>
                {routes.map((r) => <option key={r} value={r}>Route {station.iata}–{r}</option>)}
              </select>
            </label>
            <Panel title={`Reliability of the show probabilities · ${scope}`}>
              <ReliabilityChart bins={shown.bins} caption={`Predicted show probability three hours out against how often passengers showed (${scope}, learned rates)`} />
            </Panel>
            <Panel title={`Scores · ${scope}`}>
              <ScoresTable c={shown} />
            </Panel>
            <Panel title={`Oversale backtest on held-out flights · ${scope}`}>
              <BacktestPanel backtest={shown.backtest} />
            </Panel>
          </>
        ) : (
          <p>No calibration yet: the station has no held-out flights in the latest version.</p>
        )}
        {data.segments.length > 0 && (
          <Panel title={`Show rates by check-in state and booking channel · all of ${station.iata}`}>
            <SegmentsTable segments={data.segments} />
          </Panel>
        )}
        <Panel title="Outcomes of closed flights">
          <OutcomesPanel stationId={station.id} />
        </Panel>
      </div>
    </Page>
  );
}
