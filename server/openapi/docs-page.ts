/**
 * A plain page that renders /api/openapi.json: one section per path and method, parameters and
 * schemas as indented JSON. The script is served from our own origin because the CSP allows no
 * inline script and the page must work without any external CDN.
 */
export const docsPageHtml = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>Fluxtrail API</title>
<style>
  body { font: 15px/1.5 system-ui, sans-serif; margin: 2rem auto; max-width: 60rem; padding: 0 1rem; color: #23262a; background: #f7f6f2; }
  h1 { font-size: 1.4rem; } h2 { font-size: 1.05rem; margin: 1.6rem 0 0.3rem; font-family: ui-monospace, monospace; }
  .method { display: inline-block; min-width: 3.5rem; color: #8a4b22; }
  pre { background: #ecebe6; padding: 0.6rem; overflow-x: auto; font-size: 12px; }
  details { margin: 0.3rem 0; }
</style>
</head>
<body>
<h1>Fluxtrail station and record API</h1>
<p>Machine-readable: <a href="/api/openapi.json">/api/openapi.json</a> (OpenAPI 3.1).</p>
<main id="operations">Loading…</main>
<script src="/api/docs/render.js"></script>
</body>
</html>`;

export const docsPageScript = `(async () => {
  const main = document.getElementById('operations');
  const spec = await (await fetch('/api/openapi.json')).json();
  const el = (tag, text) => { const node = document.createElement(tag); if (text !== undefined) node.textContent = text; return node; };
  const block = (title, value) => { const d = el('details'); d.append(el('summary', title), el('pre', JSON.stringify(value, null, 2))); return d; };
  const resolve = (schema) => schema && schema.$ref ? spec.components.schemas[schema.$ref.split('/').pop()] : schema;
  main.textContent = '';
  for (const [path, methods] of Object.entries(spec.paths)) {
    for (const [method, op] of Object.entries(methods)) {
      const h = el('h2'); const m = el('span', method.toUpperCase()); m.className = 'method'; h.append(m, path);
      main.append(h, el('p', op.summary + '. ' + op.description));
      if (op.parameters.length) main.append(block('Parameters', op.parameters));
      for (const [type, media] of Object.entries(op.requestBody ? op.requestBody.content : {})) main.append(block('Request body, ' + type, resolve(media.schema)));
      for (const [status, response] of Object.entries(op.responses)) {
        const schema = response.content ? resolve(response.content['application/json'].schema) : undefined;
        main.append(schema ? block(status + ' ' + response.description, schema) : el('p', status + ' ' + response.description));
      }
    }
  }
})();`;
