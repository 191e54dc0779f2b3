import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTabNavBarHarness } from '@angular/material/tabs/testing';
import { SettingsPage } from './settings-page';
import { SessionStore, type Membership } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('SettingsPage', () => {
  let membership: Membership | null;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    const session = TestBed.inject(SessionStore);
    jest.spyOn(session, 'membership').mockImplementation(() => membership);
    jest.spyOn(session, 'hasRole').mockImplementation((...asked: Role[]) => asked.some((r) => membership?.roles.includes(r)));
  });

  async function tabs(roles: Role[], kind: Membership['kind'] = 'lab', organizationName?: string) {
    membership = { organizationId: 'org-1', organizationName, kind, roles };
    const fixture = TestBed.createComponent(SettingsPage);
    await fixture.whenStable();
    const bar = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTabNavBarHarness);
    const links = await bar.getLinks();
    return { labels: await Promise.all(links.map((l) => l.getLabel())), el: fixture.nativeElement as HTMLElement };
  }

  // Which roles see which area: SCREEN_ROLES in accounts/screen-roles.ts.
  it('shows a lab administrator every area, under the lab’s name', async () => {
    const { labels, el } = await tabs(['lab-admin'], 'lab', 'Kestrel Bay Radio Test Laboratory');
    expect(labels).toEqual(['People', 'API keys', 'Lab details', 'Auditor access']);
    expect(textOf(el.querySelector('.sc-sub'))).toBe('Kestrel Bay Radio Test Laboratory: people, access and the details printed on reports.');
    expect(el.querySelector('nav[aria-label="Settings areas"] a[href="/people"]')).not.toBeNull();
  });

  it('shows a manufacturer administrator only the people', async () => {
    const { labels } = await tabs(['manufacturer-admin'], 'manufacturer');
    expect(labels).toEqual(['People']);
  });

  it('shows an engineer no area, and names the organization generically when its name is unknown', async () => {
    const { labels, el } = await tabs(['engineer']);
    expect(labels).toEqual([]);
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-sub'))).toBe('Your organization: people, access and the details printed on reports.');
  });
});
