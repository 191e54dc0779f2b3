/**
 * Style sheet of the hosted payment page, served from /pay/assets/checkout.css so the page's CSP
 * can stay `style-src 'self'` with no inline style. System fonts only.
 */
export const HOSTED_PAGE_CSS = `
* { box-sizing: border-box; }
body { margin: 0; font: 16px/1.5 system-ui, sans-serif; background: #f4f5f7; color: #1d2127; }
.checkout { display: grid; grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); min-height: 100vh; }
.summary { padding: 3rem; background: #20323f; color: #f4f7fa; }
.summary h2 { font-size: .9rem; font-weight: 500; opacity: .8; margin: 0 0 .25rem; }
.total { font-size: 2rem; font-weight: 600; margin: 0 0 2rem; }
.items { list-style: none; margin: 0; padding: 0; }
.items li { display: flex; justify-content: space-between; gap: 1rem; padding: .6rem 0;
  border-bottom: 1px solid #ffffff22; }
.quantity { opacity: .7; font-size: .9rem; }
.badge { display: inline-block; font-size: .75rem; padding: .1rem .5rem; border-radius: 999px;
  background: #f2b84b; color: #1d2127; margin-bottom: 1.5rem; }
.pay { padding: 3rem; max-width: 30rem; }
h1 { font-size: 1.25rem; margin: 0 0 1rem; }
form { display: grid; gap: .9rem; }
label { display: grid; gap: .3rem; font-size: .9rem; }
input { font: inherit; padding: .6rem .7rem; border: 1px solid #c5cad3; border-radius: 6px;
  background: #fff; }
input[aria-invalid="true"] { border-color: #b3261e; }
.row { display: grid; grid-template-columns: 1fr 1fr; gap: .9rem; }
.field-error { color: #b3261e; font-size: .85rem; }
.decline { padding: .75rem 1rem; border-radius: 6px; background: #fde7e5; color: #8c1d18; margin: 0 0 1rem; }
button { font: inherit; font-weight: 600; padding: .8rem; border: 0; border-radius: 6px;
  background: #2a6f97; color: #fff; cursor: pointer; }
.cancel { display: inline-block; margin-top: 1.25rem; color: #2a6f97; }
.hint { margin-top: 2rem; font-size: .85rem; color: #5b6270; }
.status { max-width: 32rem; margin: 15vh auto; padding: 2rem; background: #fff; border-radius: 8px; }
@media (max-width: 48rem) { .checkout { grid-template-columns: 1fr; } .summary, .pay { padding: 1.5rem; } }
`;
