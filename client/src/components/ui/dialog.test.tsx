import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { ConfirmDialog, Modal, ModalClose } from './dialog';

afterEach(cleanup);

function WithModal() {
  const [open, setOpen] = useState(false);
  return (
    <>
      <button type="button">Before</button>
      <button type="button" onClick={() => setOpen(true)}>Show the gate screen</button>
      <button type="button">Behind the dialog</button>
      <Modal open={open} onOpenChange={setOpen} title="Gate screen">
        <button type="button">Print</button>
        <ModalClose>Close</ModalClose>
      </Modal>
    </>
  );
}

describe('Modal', () => {
  it('moves focus in, keeps Tab inside, closes on Esc and gives focus back to the opener', async () => {
    const user = userEvent.setup();
    render(<WithModal />);
    const opener = screen.getByRole('button', { name: 'Show the gate screen' });
    await user.click(opener);
    const dialog = screen.getByRole('dialog', { name: 'Gate screen' });
    // The page behind is hidden from assistive technology while the dialog is open.
    expect(screen.queryByRole('button', { name: 'Behind the dialog' })).toBeNull();
    expect(dialog).toContainElement(document.activeElement as HTMLElement);
    // Tab cycles among the dialog's own controls, never to the page behind it.
    for (let i = 0; i < 5; i++) {
      await user.tab();
      expect(dialog).toContainElement(document.activeElement as HTMLElement);
    }
    await user.keyboard('{Escape}');
    expect(screen.queryByRole('dialog')).not.toBeInTheDocument();
    expect(opener).toHaveFocus();
  });

  it('closes from its Close button and returns focus too', async () => {
    const user = userEvent.setup();
    render(<WithModal />);
    const opener = screen.getByRole('button', { name: 'Show the gate screen' });
    await user.click(opener);
    await user.click(screen.getByRole('button', { name: 'Close' }));
    expect(screen.queryByRole('dialog')).not.toBeInTheDocument();
    expect(opener).toHaveFocus();
  });
});

function WithConfirm({ onConfirm }: { onConfirm: () => void }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <h2 id="next-place" tabIndex={-1}>Volunteer rounds</h2>
      <button type="button" onClick={() => setOpen(true)}>Close this round</button>
      <ConfirmDialog
        open={open} onOpenChange={setOpen} title="Close the round?" consequence="Passengers can no longer offer."
        confirmLabel="Yes, close" cancelLabel="Keep it open" danger
        onConfirm={() => { onConfirm(); setOpen(false); }}
        returnFocus={() => document.getElementById('next-place')}
      />
    </>
  );
}

describe('ConfirmDialog', () => {
  it('starts on the safe choice, reads the consequence as its description, and after confirming focuses the named next place', async () => {
    const user = userEvent.setup();
    let confirmed = 0;
    render(<WithConfirm onConfirm={() => confirmed++} />);
    await user.click(screen.getByRole('button', { name: 'Close this round' }));
    const dialog = screen.getByRole('dialog', { name: 'Close the round?' });
    expect(dialog).toHaveAccessibleDescription('Passengers can no longer offer.');
    expect(screen.getByRole('button', { name: 'Keep it open' })).toHaveFocus();
    await user.click(screen.getByRole('button', { name: 'Yes, close' }));
    expect(confirmed).toBe(1);
    expect(screen.getByRole('heading', { name: 'Volunteer rounds' })).toHaveFocus();
  });
});
