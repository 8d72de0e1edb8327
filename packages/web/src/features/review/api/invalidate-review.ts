import { useQueryClient } from '@tanstack/react-query';

/**
 * A review step changes the fit's review state, which the fit view, the fits list, the events list and
 * the event's review history all show; the event's keys cover the last three.
 */
export function useInvalidateReview(fitId: string) {
  const queryClient = useQueryClient();
  return async () => {
    await queryClient.invalidateQueries({ queryKey: ['fits', fitId] });
    await queryClient.invalidateQueries({ queryKey: ['events'] });
  };
}
