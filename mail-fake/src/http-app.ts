// The catcher's HTTP side: the inbox pages for people and the JSON API that tests drive.
import express, { type ErrorRequestHandler, type Request, type Response } from 'express';
import { z } from 'zod';
import { parseFaultRequest } from './fault-spec.js';
import type { FaultSwitch } from './faults.js';
import { PAGE_CONTENT_SECURITY_POLICY } from './html.js';
import type { Inbox } from './inbox.js';
import type { MessageFilter } from './message.js';
import { renderInboxPage, renderMessagePage, renderNotFoundPage, type CatcherStatus } from './pages.js';

export interface HttpDeps {
  inbox: Inbox;
  faults: FaultSwitch;
  status: () => CatcherStatus;
}

const filterSchema = z.strictObject({
  to: z.string({ error: 'must be given once, as text' }).min(1).optional(),
  subject: z.string({ error: 'must be given once, as text' }).min(1).optional(),
  bumpboardMessageId: z.string({ error: 'must be given once, as text' }).min(1).optional(),
  messageId: z.string({ error: 'must be given once, as text' }).min(1).optional(),
});

export function createHttpApp(deps: HttpDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.use(express.json({ limit: '16kb' }));

  app.get('/', (_request, response) => {
    sendPage(response, 200, renderInboxPage(deps.inbox.list(), deps.status()));
  });

  app.get('/messages/:id', (request, response) => {
    const message = deps.inbox.get(request.params.id);
    if (message === undefined) sendPage(response, 404, renderNotFoundPage(request.params.id));
    else sendPage(response, 200, renderMessagePage(message));
  });

  app.get('/api/health', (_request, response) => {
    const status = deps.status();
    response.json({
      ok: true,
      smtp: { port: status.smtpPort, listening: status.smtpListening },
      messages: deps.inbox.size,
      fault: status.fault,
    });
  });

  app.get('/api/messages', (request, response) => {
    const filter = parseFilter(request);
    if (typeof filter === 'string') {
      response.status(400).json({ error: filter });
      return;
    }
    const messages = deps.inbox.list(filter);
    response.json({ count: messages.length, messages });
  });

  app.get('/api/messages/:id', (request, response) => {
    const message = deps.inbox.get(request.params.id);
    if (message === undefined) response.status(404).json({ error: `id: no message with id "${request.params.id}"` });
    else response.json(message);
  });

  app.delete('/api/messages', async (_request, response) => {
    response.json({ cleared: await deps.inbox.clear() });
  });

  app.get('/api/faults', (_request, response) => {
    response.json({ fault: deps.faults.current() });
  });

  app.post('/api/faults', async (request, response) => {
    const parsed = parseFaultRequest(request.body);
    if (!parsed.ok) {
      response.status(400).json({ error: parsed.error });
      return;
    }
    // Resolves after a 'down' fault has closed the listener, so the caller can expect refusals right away.
    response.json({ fault: await deps.faults.set(parsed.plan) });
  });

  app.delete('/api/faults', async (_request, response) => {
    await deps.faults.clear();
    response.json({ fault: null });
  });

  app.use('/api', (request, response) => {
    response.status(404).json({ error: `path: no API route ${request.method} ${request.originalUrl}` });
  });

  app.use(jsonErrorHandler);
  return app;
}

function parseFilter(request: Request): MessageFilter | string {
  const parsed = filterSchema.safeParse(request.query);
  if (parsed.success) return parsed.data;
  return parsed.error.issues
    .map((issue) => {
      if (issue.code === 'unrecognized_keys') {
        return `query: unknown filter ${issue.keys.join(', ')} (known: to, subject, bumpboardMessageId, messageId)`;
      }
      return `${issue.path.join('.')}: ${issue.message}`;
    })
    .join('; ');
}

function sendPage(response: Response, status: number, html: string): void {
  response.status(status).set('Content-Security-Policy', PAGE_CONTENT_SECURITY_POLICY).type('html').send(html);
}

const jsonErrorHandler: ErrorRequestHandler = (error: { type?: string; status?: number; message?: string }, _request, response, _next) => {
  if (error.type === 'entity.parse.failed') {
    response.status(400).json({ error: 'body: not valid JSON' });
    return;
  }
  if (error.type === 'entity.too.large') {
    response.status(413).json({ error: 'body: larger than 16 KB' });
    return;
  }
  const status = typeof error.status === 'number' && error.status >= 400 && error.status < 600 ? error.status : 500;
  response.status(status).json({ error: error.message ?? 'internal error' });
};
