// The alerts' query keys live here, not in the alerts feature: the actions that raise or resolve an alert (a void,
// a re-issue) belong to other features, and each must refresh the alerts list on screen at once.
export const alertKeys = {
  all: ['alerts'] as const,
  list: (stationId: number | undefined) => [...alertKeys.all, 'list', stationId ?? 'all'] as const,
};
