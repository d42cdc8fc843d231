// The human pages: sender-controlled text is escaped, and a message's HTML only runs in a sandboxed iframe.
// Escaping rule: OWASP Cross Site Scripting Prevention Cheat Sheet, "output encoding for HTML contexts"
// (encode & < > " ' as entities), from memory. Sandbox: HTML Living Standard, the iframe sandbox attribute
// (an empty value turns on every restriction, scripts included), from memory.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTransport, removeDataDir, startCatcher, type RunningCatcher } from './helpers.js';

const XSS_SUBJECT = '<script>alert(1)</script><img src=x onerror="alert(2)">';
const XSS_SUBJECT_ESCAPED = '&lt;script&gt;alert(1)&lt;/script&gt;&lt;img src=x onerror=&quot;alert(2)&quot;&gt;'; // derived

describe('mail catcher pages', () => {
  let catcher: RunningCatcher;
  let messageId: string;

  beforeAll(async () => {
    catcher = await startCatcher();
    await makeTransport(catcher.ports.smtpPort).sendMail({
      from: 'Bumpboard <notices@bumpboard.test>',
      to: 'agent@station.test',
      subject: XSS_SUBJECT,
      text: 'Plain <b>text</b> & more',
      html: '<p onclick="steal()">Hello</p><script>fetch("/api/messages")</script>',
    });
    messageId = catcher.mailFake.inbox.list()[0].id;
  });

  afterAll(async () => {
    await catcher.mailFake.close();
    removeDataDir(catcher.dataDir);
  });

  it('labels the inbox page and renders an XSS attempt in the subject as inert text', async () => {
    const response = await fetch(`${catcher.baseUrl}/`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/html/);
    expect(response.headers.get('content-security-policy')).toContain("default-src 'none'");
    const page = await response.text();
    expect(page).toContain('Local mail catcher (test mail)');
    expect(page).toContain(XSS_SUBJECT_ESCAPED);
    expect(page).not.toContain('<script>');
    expect(page).not.toContain('<img');
    expect(page).toContain(`href="/messages/${messageId}"`);
  });

  it('lists the newest message first', async () => {
    await makeTransport(catcher.ports.smtpPort).sendMail({ from: 'a@bumpboard.test', to: 'b@station.test', subject: 'Newest one', text: 'n' });
    const page = await (await fetch(`${catcher.baseUrl}/`)).text();
    expect(page.indexOf('Newest one')).toBeGreaterThan(-1);
    expect(page.indexOf('Newest one')).toBeLessThan(page.indexOf(XSS_SUBJECT_ESCAPED));
  });

  it('shows the message text escaped and its HTML only inside a sandboxed srcdoc iframe', async () => {
    const page = await (await fetch(`${catcher.baseUrl}/messages/${messageId}`)).text();
    expect(page).toContain('Plain &lt;b&gt;text&lt;/b&gt; &amp; more');
    expect(page).not.toContain('<script>');
    expect(page).not.toContain('<p onclick');

    const iframe = page.match(/<iframe [^>]*>/)?.[0] ?? '';
    expect(iframe).toContain('sandbox=""');
    // The HTML sits in the attribute with its quotes escaped, so it cannot close the attribute early.
    expect(iframe).toContain('srcdoc="&lt;p onclick=&quot;steal()&quot;&gt;Hello&lt;/p&gt;&lt;script&gt;');
    expect(iframe).not.toMatch(/sandbox="[^"]*allow-scripts/);
  });

  it('answers an unknown message id with a 404 page that escapes the id', async () => {
    const response = await fetch(`${catcher.baseUrl}/messages/${encodeURIComponent('<b>nope</b>')}`);
    expect(response.status).toBe(404);
    const page = await response.text();
    expect(page).toContain('&lt;b&gt;nope&lt;/b&gt;');
    expect(page).not.toContain('<b>nope');
  });
});
