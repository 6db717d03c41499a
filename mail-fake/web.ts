import type { IncomingMessage, ServerResponse } from 'node:http';
import { inboxPage, MAIL_HTML_CSP, messagePage, notFoundPage, PAGE_CSP } from './pages.js';
import type { MessageStore } from './store.js';

function send(res: ServerResponse, status: number, type: string, body: string, csp = PAGE_CSP): void {
  res.writeHead(status, {
    'Content-Type': `${type}; charset=utf-8`,
    'Content-Security-Policy': csp,
    'Cache-Control': 'no-store',
    'X-Content-Type-Options': 'nosniff',
  });
  res.end(body);
}

function sendJson(res: ServerResponse, status: number, value: unknown): void {
  send(res, status, 'application/json', JSON.stringify(value));
}

/** Routes of the inbox web page and its small JSON API. */
export function webHandler(store: MessageStore) {
  return (req: IncomingMessage, res: ServerResponse): void => {
    const { pathname } = new URL(req.url ?? '/', 'http://mail-sink.local');
    const method = req.method ?? 'GET';
    const messageMatch = /^\/(api\/)?messages\/(\d+)(\/html)?$/.exec(pathname);

    if (pathname === '/api/messages' && method === 'GET') return sendJson(res, 200, store.list());
    if (pathname === '/api/messages' && method === 'DELETE') {
      store.clear();
      res.writeHead(204).end();
      return;
    }
    if (pathname === '/clear' && method === 'POST') {
      store.clear();
      res.writeHead(303, { Location: '/' }).end();
      return;
    }
    if (pathname === '/' && method === 'GET') return send(res, 200, 'text/html', inboxPage(store.list()));
    if (messageMatch && method === 'GET') {
      const [, api, id, html] = messageMatch;
      const message = store.get(Number(id));
      if (api) return message ? sendJson(res, 200, message) : sendJson(res, 404, { error: { code: 'not_found', message: `no message ${id}` } });
      if (!message) return send(res, 404, 'text/html', notFoundPage());
      if (html) return message.html ? send(res, 200, 'text/html', message.html, MAIL_HTML_CSP) : send(res, 404, 'text/html', notFoundPage());
      return send(res, 200, 'text/html', messagePage(message));
    }
    if (pathname.startsWith('/api/')) return sendJson(res, 404, { error: { code: 'not_found', message: `no route ${method} ${pathname}` } });
    send(res, 404, 'text/html', notFoundPage());
  };
}
