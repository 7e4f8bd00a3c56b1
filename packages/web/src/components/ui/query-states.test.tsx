import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../lib/api-client';
import { EmptyState, ErrorState, LoadingState } from './query-states';

afterEach(cleanup);

describe('LoadingState', () => {
  it('is a status with its label', () => {
    render(<LoadingState label="Loading the dive…" />);
    expect(screen.getByRole('status').textContent).toBe('Loading the dive…');
  });
});

describe('ErrorState', () => {
  it("names the server's message and status, and retries on request", () => {
    const onRetry = vi.fn();
    render(
      <ErrorState
        title="The dive could not be loaded"
        error={new ApiError(404, { code: 'not-found', message: 'No such dive.' })}
        onRetry={onRetry}
      />,
    );
    const alert = screen.getByRole('alert');
    expect(alert.textContent).toMatch(/The dive could not be loaded/);
    expect(alert.textContent).toMatch(/No such dive\. \(HTTP 404\)/);
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(onRetry).toHaveBeenCalledTimes(1);
  });
});

describe('EmptyState', () => {
  it('shows its title and hint', () => {
    render(<EmptyState title="No dives yet">Upload a log to see its dives here.</EmptyState>);
    expect(screen.getByRole('heading', { name: 'No dives yet' })).toBeTruthy();
    expect(screen.getByText('Upload a log to see its dives here.')).toBeTruthy();
  });
});
