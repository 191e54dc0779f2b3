import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * A drop zone with a "Choose file…" button: emits the files dropped or picked. The file input
 * itself is hidden from the tab order and from assistive technology; the button stands for it.
 */
@Component({
  selector: 'sc-file-drop',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="drop" [class.dragging]="dragging()" (dragover)="over($event)" (dragleave)="dragging.set(false)" (drop)="drop($event)">
      <mat-icon aria-hidden="true">upload_file</mat-icon>
      <div class="text">
        <strong>{{ title() }}</strong>
        <span class="sc-muted">{{ hint() }}</span>
      </div>
      <input #picker class="visually-hidden" type="file" multiple [accept]="accept()" (change)="chosen.emit(list(picker.files))" tabindex="-1" aria-hidden="true" />
      <button mat-stroked-button type="button" (click)="picker.value = ''; picker.click()" [disabled]="disabled()">Choose file…</button>
    </div>
  `,
  styles: `
    .drop {
      display: flex; align-items: center; gap: 14px; flex-wrap: wrap;
      border: 2px dashed var(--sc-line); border-radius: 10px; padding: 14px 16px; background: #fafcfc;
      &.dragging { border-color: var(--sc-accent); background: #e9f3f3; }
      > mat-icon { color: var(--sc-accent); }
    }
    .text { display: flex; flex-direction: column; gap: 2px; flex: 1 1 240px; font-size: 14px; span { font-size: 12px; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FileDrop {
  readonly title = input.required<string>();
  readonly hint = input('');
  /** The file input's accept list (extensions), a hint for the picker only: content decides. */
  readonly accept = input('');
  readonly disabled = input(false);
  readonly chosen = output<File[]>();
  protected readonly dragging = signal(false);

  protected over(event: DragEvent): void {
    event.preventDefault();
    if (!this.disabled()) this.dragging.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    if (!this.disabled()) this.chosen.emit(this.list(event.dataTransfer?.files ?? null));
  }

  protected list(files: FileList | null): File[] {
    return files ? [...files] : [];
  }
}
