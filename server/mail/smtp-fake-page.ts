// The local mail catcher's inbox page: one self-contained HTML document (no build step).
// Data comes from the catcher's own JSON (/inbox/messages); every value is written with
// textContent, and message HTML only ever goes into a sandboxed srcdoc frame.

const css = `
:root { --ink: #17212B; --paper: #F7F5F0; --rule: #8795A1; --card: #FFFFFF; --undo: #C2410C; }
* { box-sizing: border-box; }
html, body { margin: 0; height: 100%; }
body { background: var(--paper); color: var(--ink); font: 16px/1.45 'IBM Plex Sans', sans-serif; }
header { display: flex; flex-wrap: wrap; align-items: center; gap: 12px; padding: 12px 16px; border-bottom: 1px solid var(--rule); background: var(--card); }
header h1 { font-size: 18px; margin: 0; font-weight: 600; }
header .where { font-family: 'IBM Plex Mono', monospace; font-size: 13px; color: #4A5763; }
header .spacer { flex: 1; }
#status { font-size: 13px; color: #4A5763; }
button { font: inherit; min-height: 44px; padding: 0 16px; border-radius: 6px; cursor: pointer; }
button:focus-visible, .row:focus-visible { outline: 3px solid var(--ink); outline-offset: 2px; }
#clear { background: var(--card); color: var(--undo); border: 2px solid var(--undo); font-weight: 600; }
#clear:disabled { color: var(--rule); border-color: var(--rule); cursor: default; }
main { display: grid; grid-template-columns: minmax(280px, 380px) 1fr; height: calc(100% - 69px); }
#list { margin: 0; padding: 0; list-style: none; overflow: auto; border-right: 1px solid var(--rule); }
.row { display: block; width: 100%; text-align: left; background: none; border: 0; border-bottom: 1px solid var(--rule); border-radius: 0; padding: 10px 16px; min-height: 64px; color: var(--ink); }
.row[aria-current="true"] { background: var(--card); box-shadow: inset 4px 0 0 var(--ink); }
.row .subject { display: block; font-weight: 600; overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
.row .meta { display: flex; justify-content: space-between; gap: 8px; font-size: 13px; color: #4A5763; }
.row .meta span:first-child { overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
.row .meta span:last-child { flex: none; white-space: nowrap; }
#detail { overflow: auto; padding: 16px 24px; }
#detail h2 { font-size: 20px; margin: 0 0 8px; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: 2px 12px; margin: 0 0 16px; font-size: 14px; }
dt { color: #4A5763; }
dd { margin: 0; word-break: break-word; }
h3 { font-size: 14px; text-transform: uppercase; letter-spacing: 0.06em; color: #4A5763; margin: 20px 0 6px; border-top: 1px solid var(--rule); padding-top: 12px; }
pre { white-space: pre-wrap; word-break: break-word; background: var(--card); border: 1px solid var(--rule); border-radius: 6px; padding: 12px; margin: 0; font: 14px/1.5 'IBM Plex Mono', monospace; }
iframe { width: 100%; min-height: 360px; border: 1px solid var(--rule); border-radius: 6px; background: #FFFFFF; }
.empty { padding: 24px 16px; color: #4A5763; }
.notice { margin: 0; padding: 8px 16px; background: #FFF7ED; border-bottom: 1px solid var(--undo); color: var(--ink); }
@media (max-width: 760px) {
  main { display: block; height: auto; }
  #list { border-right: 0; max-height: none; }
  #detail { border-top: 2px solid var(--ink); }
}
`;

const script = `
const listEl = document.getElementById('list');
const detailEl = document.getElementById('detail');
const statusEl = document.getElementById('status');
const noticeEl = document.getElementById('notice');
const clearBtn = document.getElementById('clear');
let selected = null;
let shown = '';

function el(tag, attrs, text) {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs || {})) e.setAttribute(k, v);
  if (text !== undefined) e.textContent = text;
  return e;
}
const when = (iso) => new Date(iso).toLocaleString(undefined, { dateStyle: 'short', timeStyle: 'medium' });

async function getJson(url) {
  const res = await fetch(url, { cache: 'no-store' });
  if (!res.ok) throw new Error(res.status === 404 ? 'gone' : 'HTTP ' + res.status);
  return res.json();
}

function renderList(items) {
  const key = JSON.stringify(items.map((m) => m.id)) + selected;
  if (key === shown) return;
  shown = key;
  listEl.replaceChildren();
  clearBtn.disabled = items.length === 0;
  if (!items.length) {
    listEl.append(el('li', { class: 'empty' }, 'No mail yet. Whatever the app sends to this SMTP server appears here.'));
    return;
  }
  for (const m of items) {
    const li = el('li');
    const b = el('button', { class: 'row', type: 'button', 'aria-current': String(m.id === selected) });
    b.append(el('span', { class: 'subject' }, m.subject || '(no subject)'));
    const meta = el('span', { class: 'meta' });
    meta.append(el('span', {}, 'To ' + (m.to.join(', ') || '(nobody)')), el('span', {}, when(m.createdAt)));
    b.append(meta);
    b.addEventListener('click', () => open(m.id));
    li.append(b);
    listEl.append(li);
  }
}

async function refresh() {
  try {
    const data = await getJson('inbox/messages');
    renderList(data.items);
    statusEl.textContent = data.total + (data.total === 1 ? ' message' : ' messages') + ', checked ' + new Date().toLocaleTimeString();
    noticeEl.hidden = true;
    if (selected && !data.items.some((m) => m.id === selected)) showNothing();
  } catch {
    noticeEl.hidden = false;
    noticeEl.textContent = 'Cannot reach the mail catcher. Is it still running? Trying again every 5 seconds.';
  }
}

function showNothing() {
  selected = null;
  shown = '';
  detailEl.replaceChildren(el('p', { class: 'empty' }, 'Pick a message to read it.'));
}

async function open(id) {
  selected = id;
  shown = '';
  await refresh();
  let m;
  try {
    m = await getJson('inbox/messages/' + encodeURIComponent(id));
  } catch {
    detailEl.replaceChildren(el('p', { class: 'empty' }, 'This message is gone (deleted or dropped as the oldest).'));
    return;
  }
  const parts = [el('h2', {}, m.subject || '(no subject)')];
  const dl = el('dl');
  for (const [k, v] of [['From', m.from], ['To', m.to.join(', ')], ['Received', when(m.createdAt)], ['Size', m.size + ' bytes']]) {
    dl.append(el('dt', {}, k), el('dd', {}, v));
  }
  parts.push(dl, el('h3', {}, 'Plain text'), el('pre', {}, m.text || '(no plain-text part)'));
  parts.push(el('h3', {}, 'HTML'));
  if (m.html) {
    const frame = el('iframe', { sandbox: '', title: 'HTML version of the message', referrerpolicy: 'no-referrer' });
    frame.srcdoc = m.html;
    parts.push(frame);
  } else {
    parts.push(el('p', {}, '(no HTML part)'));
  }
  detailEl.replaceChildren(...parts);
  detailEl.focus();
}

clearBtn.addEventListener('click', async () => {
  if (!confirm('Delete every message held here? This cannot be undone.')) return;
  await fetch('api/v1/messages', { method: 'DELETE' });
  showNothing();
  await refresh();
});

showNothing();
refresh();
setInterval(refresh, 5000);
`;

export function inboxPage(nonce: string) {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Toolgate local mail</title>
<style>${css}</style>
</head>
<body>
<header>
  <h1>Toolgate local mail</h1>
  <span class="where">development only: nothing here leaves this machine</span>
  <span class="spacer"></span>
  <span id="status" role="status" aria-live="polite">Loading...</span>
  <button id="clear" type="button" disabled>Delete all</button>
</header>
<p id="notice" class="notice" role="alert" hidden></p>
<main>
  <ul id="list" aria-label="Messages, newest first"></ul>
  <section id="detail" aria-label="Message" tabindex="-1"></section>
</main>
<script nonce="${nonce}">${script}</script>
</body>
</html>`;
}
