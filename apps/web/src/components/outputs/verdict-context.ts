import type { VerdictContext } from '@cribra/lang';
import { createContext } from 'react';

/**
 * What a verdict card reads besides its output: the notebook's notes, so that its sentence can say
 * when a note states more than the checked range. Provided by whoever shows a notebook's cells.
 */
export const VerdictContextValue = createContext<VerdictContext>({});
