import { useState } from 'react';
import type { PassengerCare } from '@shared/schemas/care';
import { Button } from '../../../components/ui/button';
import { ApiRequestError } from '../../../lib/api-client';
import { useMailCare } from '../api/desk-care';

/**
 * Mails the passenger what the desk recorded, in the booking's language: a denied passenger the written statement
 * again (now with their choice and the care given), a volunteer a short summary. Asking twice sends nothing new.
 */
export function MailCareButton({ flightId, passenger: p }: { flightId: number; passenger: PassengerCare }) {
  const mail = useMailCare(flightId);
  const [message, setMessage] = useState('');
  const [error, setError] = useState('');
  if (!p.choice && p.given.length === 0) return null;
  const send = () => {
    setError('');
    setMessage('');
    mail.mutate({ compensationId: p.compensationId }, {
      onSuccess: (r) => setMessage(r.created
        ? `${r.kind === 'written-statement' ? 'The updated written statement' : 'A summary'} is queued for the passenger’s e-mail.`
        : 'Already sent: nothing new since the last mail.'),
      onError: (err) => setError(err instanceof ApiRequestError ? err.message : 'The mail could not be queued.'),
    });
  };
  return (
    <div className="mt-3 border-t border-line pt-2">
      <Button type="button" onClick={send} disabled={mail.isPending}>
        {p.voluntary ? 'Mail the passenger this choice and care' : 'Mail the updated written statement'}
      </Button>
      <p role="status" className="mt-1">{message}</p>
      {error && <p role="alert" className="font-bold text-alert">{error}</p>}
    </div>
  );
}
