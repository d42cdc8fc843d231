import { queryOptions } from '@tanstack/react-query';
import { stationListSchema } from '@shared/schemas/stations';
import { api } from '../../../lib/api-client';

export const stationKeys = { all: ['stations'] as const, list: () => [...stationKeys.all, 'list'] as const };

export const stationsQueryOptions = () => queryOptions({ queryKey: stationKeys.list(), queryFn: () => api.get('/stations', stationListSchema) });
