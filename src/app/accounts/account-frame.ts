import { ChangeDetectionStrategy, Component, ViewEncapsulation, input } from '@angular/core';

/**
 * The frame of the signed-out account screens (sign-up, invitation, password reset): the brand
 * on the left and the screen's own panel, projected, on the right. Unencapsulated styles are
 * scoped by the .sc-account class so every panel inside looks alike.
 */
@Component({
  selector: 'sc-account-frame',
  template: `
    <main class="sc-account">
      <section class="sc-account-brand" aria-label="About Sidecheck">
        <svg viewBox="0 0 32 32" width="44" height="44" aria-hidden="true"><rect width="32" height="32" rx="7" fill="#f4d35e" /><path d="M5 22 C10 22 11 8 16 8 S22 22 27 22" fill="none" stroke="#0d5c63" stroke-width="2.6" stroke-linecap="round" /></svg>
        <p class="sc-account-name">Sidecheck</p>
        <p>{{ tagline() }}</p>
      </section>
      <div class="sc-account-panel">
        <ng-content />
      </div>
    </main>
  `,
  styles: `
    .sc-account {
      min-height: 100vh; display: grid; grid-template-columns: minmax(260px, 1fr) minmax(320px, 520px);
      align-items: center; gap: 48px; padding: 40px clamp(24px, 6vw, 96px); box-sizing: border-box;
      background: linear-gradient(135deg, #0d3f45 0%, #0d5c63 55%, #2a7f7a 100%);
    }
    .sc-account-brand { color: #e8f3f2; max-width: 460px; font-size: 17px; line-height: 1.55; }
    .sc-account-brand p { margin: 0; }
    .sc-account-name { font: 500 36px/1.1 Roboto, sans-serif !important; margin: 16px 0 12px !important; color: #fff; }
    .sc-account-panel > * {
      background: #fff; border-radius: 14px; padding: 28px 28px 32px; display: flex; flex-direction: column;
      gap: 14px; box-shadow: 0 12px 40px rgba(0, 0, 0, 0.25); position: relative; overflow: hidden;
    }
    .sc-account-panel h1 { margin: 0 0 4px; font: 500 22px/1.2 Roboto, sans-serif; }
    .sc-account-panel mat-progress-bar { position: absolute; top: 0; left: 0; right: 0; }
    .sc-account-panel button[type='submit'] { height: 44px; }
    .sc-account-panel .links { display: flex; gap: 16px; flex-wrap: wrap; font-size: 14px; }
    .sc-account-panel .done { background: var(--sc-pass-bg); color: var(--sc-pass); border-radius: 8px; padding: 12px 16px; }
    @media (max-width: 840px) { .sc-account { grid-template-columns: 1fr; gap: 24px; } }
  `,
  encapsulation: ViewEncapsulation.None,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountFrame {
  readonly tagline = input('Compliance testing for HF single-sideband transmitters: readings, verdicts with uncertainty, four-eyes review and signed reports.');
}
