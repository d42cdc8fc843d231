import '@testing-library/jest-dom/vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { ApiRequestError } from '../../lib/api-client';
import { FormProblems, issueProblems } from './form-problems';

afterEach(cleanup);

const refusal = new ApiRequestError(400, { error: 'invalid_request', message: 'carrier', details: [{ field: 'manual.carrier', rule: 'must be a 2-3 character airline designator' }] });

describe('the shared error summary', () => {
  it('takes focus on a refused submit and names each field by its label, with the rule, linked to the field', async () => {
    render(
      <>
        <label htmlFor="carrier">Carrier</label>
        <input id="carrier" />
        <FormProblems error={refusal} labels={{ 'manual.carrier': 'Carrier' }} fieldIds={{ 'manual.carrier': 'carrier' }} />
      </>,
    );
    const summary = screen.getByRole('alert');
    expect(summary).toHaveFocus();
    expect(summary).toHaveTextContent('Carrier: must be a 2-3 character airline designator');
    await userEvent.click(screen.getByRole('link', { name: 'Carrier' }));
    expect(screen.getByLabelText('Carrier')).toHaveFocus();
  });

  it('shows problems found before sending the same way, and schema issues by their path', () => {
    render(<FormProblems error={null} problems={issueProblems([{ path: ['drawerId'], message: 'drawerId is required' }])} labels={{ drawerId: 'Drawer' }} />);
    expect(screen.getByRole('alert')).toHaveFocus();
    expect(screen.getByRole('alert')).toHaveTextContent('Drawer: is required');
  });

  it('can stay out of focus for a failure that is not an answer to a submit', () => {
    render(<FormProblems error={new Error('the list could not be loaded')} takeFocus={false} />);
    expect(screen.getByRole('alert')).toHaveTextContent('Not done: the list could not be loaded');
    expect(screen.getByRole('alert')).not.toHaveFocus();
  });

  it('is absent while nothing is refused', () => {
    render(<FormProblems error={null} problems={null} />);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
