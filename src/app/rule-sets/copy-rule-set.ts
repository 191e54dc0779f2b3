import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CopyRuleSetDialog, type CopyRuleSetDialogData } from './copy-rule-set-dialog';
import { RuleSetsApi, type RuleSet } from './rule-sets-api';

/** Copy a rule set into the lab: ask for the name, copy, open the copy in the editor. */
@Injectable({ providedIn: 'root' })
export class CopyRuleSet {
  private readonly dialog = inject(MatDialog);
  private readonly api = inject(RuleSetsApi);
  private readonly router = inject(Router);

  /** Resolves false when cancelled; rejects with the HTTP error when the copy fails. */
  async copy(source: Pick<RuleSet, 'id' | 'name' | 'isSample'>): Promise<boolean> {
    const data: CopyRuleSetDialogData = { sourceName: source.name, isSample: source.isSample };
    const name = await firstValueFrom(this.dialog.open<CopyRuleSetDialog, CopyRuleSetDialogData, string>(CopyRuleSetDialog, { data }).afterClosed());
    if (!name) return false;
    const copy = await firstValueFrom(this.api.copy(source.id, name));
    await this.router.navigate(['/rule-sets', copy.id], { state: { notice: `Copied as “${copy.name}”, version 1. Edit it below.` } });
    return true;
  }
}
