import type { LedgerBlockSummary, Page } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const ledgerKey = ['ledger', 'blocks'] as const;

export function listLedgerBlocks(page: number, signal?: AbortSignal): Promise<Page<LedgerBlockSummary>> {
  return api.get<Page<LedgerBlockSummary>>('/ledger/blocks', { signal, query: { page, pageSize: 100 } });
}

export const ledgerBlocksQueryOptions = (page: number) =>
  queryOptions({ queryKey: [...ledgerKey, page], queryFn: ({ signal }) => listLedgerBlocks(page, signal) });

export function useLedgerBlocks(page: number) {
  return useQuery(ledgerBlocksQueryOptions(page));
}
