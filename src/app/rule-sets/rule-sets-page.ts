import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import { CopyRuleSet } from './copy-rule-set';
import { RuleSetsApi, type RuleSet } from './rule-sets-api';

/** Rule sets: the lab's own, then the built-in samples (to be verified against the current edition before use). */
@Component({
  selector: 'sc-rule-sets-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './rule-sets-page.html',
  styleUrl: './rule-sets-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RuleSetsPage {
  private readonly api = inject(RuleSetsApi);
  private readonly copier = inject(CopyRuleSet);
  private readonly session = inject(SessionStore);

  protected readonly canWrite = this.session.hasRole(...SCREEN_ROLES.labRecordsWrite);
  protected readonly all = signal<RuleSet[]>([]);
  protected readonly own = computed(() => this.all().filter((r) => !r.builtIn));
  protected readonly samples = computed(() => this.all().filter((r) => r.builtIn));
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.list().subscribe({
      next: (page) => {
        this.all.set(page.items);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  /** The first three source documents with their editions, for the card. */
  protected sourcesText(r: RuleSet): string {
    const refs = r.body.references;
    return refs.slice(0, 3).map((x) => `${x.document}${x.clause ? ' ' + x.clause : ''} (${x.edition})`).join('; ') + (refs.length > 3 ? '; …' : '');
  }

  async copy(source: RuleSet): Promise<void> {
    try {
      await this.copier.copy(source);
    } catch (error) {
      this.error.set(problemMessage(error));
    }
  }
}
