import type { RunOutput, RunView } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { getRun } from './get-run';
import { notebookKeys } from './keys';

/**
 * The outputs of a run as a cell shows them: inline when the notebook read carried them, else
 * (`outputsOmitted`: stored larger than the read's inline limit) fetched once from GET /runs/:id.
 * A finished run's outputs never change, so the fetched copy is kept.
 */
export function useRunOutputs(run: RunView): { outputs: RunOutput[] | null; loading: boolean; error: Error | null } {
  const omitted = !!run.outputsOmitted;
  const q = useQuery({
    queryKey: notebookKeys.run(run.id),
    queryFn: ({ signal }) => getRun(run.id, signal),
    enabled: omitted,
    staleTime: Infinity,
  });
  if (!omitted) return { outputs: run.outputs, loading: false, error: null };
  return { outputs: q.data?.outputs ?? null, loading: q.isPending, error: q.error };
}
