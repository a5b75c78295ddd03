import type { RunView } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithApp } from '../../../test-utils/render';
import { RunOutputs } from './run-outputs';

const failed = (error: RunView['error']) => ({ id: '00000000-0000-4000-8000-000000000001', status: 'failed', error, outputs: [] }) as unknown as RunView;

describe('RunOutputs', () => {
  it('introduces an error from a builtin by its kind, like every other error', () => {
    renderWithApp(<RunOutputs run={failed({ kind: 'domain', message: 'primebefore: there is no prime below 2', line: 1, column: 1 })} />);
    expect(screen.getByRole('alert').textContent).toBe('Domain error (line 1, column 1): primebefore: there is no prime below 2');
  });

  it('names an unknown kind instead of leaving the title blank', () => {
    renderWithApp(<RunOutputs run={failed({ kind: 'weird' as never, message: 'x' })} />);
    expect(screen.getByRole('alert').textContent).toBe('Error (weird): x');
  });
});
