// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';

describe('button states', () => {
  it('when a button is inactive with a reason, then it looks inactive, stays reachable by keyboard, says why and does nothing', async () => {
    const onClick = vi.fn();
    const user = userEvent.setup();
    render(
      <Button variant="quiet" disabled disabledReason="This is the first page." onClick={onClick}>
        Previous
      </Button>,
    );
    const button = screen.getByRole('button', { name: 'Previous' });
    expect(button.getAttribute('aria-disabled')).toBe('true');
    expect(button.className).toMatch(/opacity-55/);
    expect(button.getAttribute('title')).toBe('This is the first page.');
    expect(screen.getByRole('button', { name: 'Previous', description: 'This is the first page.' })).toBe(button);
    await user.tab();
    expect(document.activeElement).toBe(button);
    await user.click(button);
    expect(onClick).not.toHaveBeenCalled();
  });

  it('when something is deleted for good, then both the asking button and the final one look destructive', async () => {
    const user = userEvent.setup();
    render(<ConfirmDelete label="Delete bed North 1" question="Delete the bed “North 1”?" consequence="Removed for good." confirmLabel="Delete bed" onConfirm={vi.fn()} pending={false} error={null} />);
    const ask = screen.getByRole('button', { name: 'Delete bed North 1' });
    expect(ask.dataset.variant).toBe('quiet-danger');
    await user.click(ask);
    expect(screen.getByRole('button', { name: 'Delete bed' }).dataset.variant).toBe('danger');
  });
});
