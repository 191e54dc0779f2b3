/**
 * Style sheet of the inbox pages, served as /inbox.css so the pages need no inline style and
 * their Content-Security-Policy can stay at `style-src 'self'`. System fonts only: nothing is
 * fetched from elsewhere.
 */
export const INBOX_CSS = `
:root { color-scheme: light dark; --line: #8884; --muted: #777; --accent: #2a6f97; }
* { box-sizing: border-box; }
body { margin: 0; font: 15px/1.45 system-ui, sans-serif; }
header { display: flex; gap: 1rem; align-items: baseline; padding: .8rem 1.5rem;
  border-bottom: 1px solid var(--line); }
header a { font-weight: 600; color: inherit; text-decoration: none; }
header span, .muted { color: var(--muted); }
main { padding: 1rem 1.5rem; max-width: 80rem; }
.toolbar { display: flex; flex-wrap: wrap; gap: .75rem; align-items: end; margin-bottom: 1rem; }
.toolbar form { display: flex; gap: .5rem; align-items: end; }
label { display: grid; gap: .2rem; font-size: .85rem; }
input, button { font: inherit; padding: .35rem .6rem; border: 1px solid var(--line);
  border-radius: 4px; }
button { cursor: pointer; background: var(--accent); color: #fff; border-color: var(--accent); }
button.danger { background: #b3261e; border-color: #b3261e; }
table { border-collapse: collapse; width: 100%; }
th, td { text-align: left; padding: .4rem .6rem; border-bottom: 1px solid var(--line);
  vertical-align: top; }
th { font-size: .8rem; text-transform: uppercase; letter-spacing: .04em; color: var(--muted); }
td a { color: var(--accent); }
dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; }
dt { color: var(--muted); }
dd { margin: 0; word-break: break-word; }
pre { white-space: pre-wrap; padding: .75rem; border: 1px solid var(--line); border-radius: 4px; }
iframe { width: 100%; height: 32rem; border: 1px solid var(--line); border-radius: 4px;
  background: #fff; }
section { margin-top: 1.5rem; }
h1 { font-size: 1.3rem; margin: .5rem 0 1rem; }
h2 { font-size: 1rem; margin: 0 0 .5rem; }
`;
