import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import { labelPositions, type SheetLabelStock } from '@batchproof/shared';

/**
 * The sheet's label positions as a grid to click: the chosen start and the positions after it
 * print; the ones before it show greyed as already used. A radio group for the keyboard: Tab
 * reaches the chosen position, the arrow keys move it, Home and End go to the first and last.
 */
@Component({
  selector: 'bp-start-position-grid',
  template: `
    <div
      class="sheet"
      role="radiogroup"
      [attr.aria-label]="'Start position on ' + stock().name"
      [style.grid-template-columns]="'repeat(' + stock().across + ', 1fr)'"
      [style.grid-template-rows]="'repeat(' + stock().down + ', 1fr)'"
      [style.aspect-ratio]="stock().pageWidthMm + ' / ' + stock().pageHeightMm"
      [style.padding]="padding()"
      [style.column-gap.%]="gapX()"
      [style.row-gap.%]="gapY()"
    >
      @for (p of positions(); track p) {
        <button
          type="button"
          role="radio"
          class="position"
          [class.used]="p < start()"
          [class.start]="p === start()"
          [class.circle]="round()"
          [attr.aria-checked]="p === start()"
          [attr.aria-label]="label(p)"
          [attr.data-position]="p"
          [tabindex]="p === start() ? 0 : -1"
          (click)="start.set(p)"
          (keydown)="move($event)"
        >
          {{ p }}
        </button>
      }
    </div>
    <p class="legend">
      Position {{ start() }} of {{ positions().length }}:
      {{ start() === 1 ? 'a fresh sheet.' : start() - 1 + ' used labels skipped (greyed).' }}
    </p>
  `,
  styles: `
    :host {
      display: block;
      max-width: 18rem;
    }
    .sheet {
      display: grid;
      box-sizing: border-box;
      border: 1px solid var(--mat-sys-outline);
      background: var(--mat-sys-surface);
    }
    .position {
      min-width: 0;
      min-height: 0;
      padding: 0;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 3px;
      background: var(--mat-sys-surface-container-lowest);
      color: var(--mat-sys-on-surface);
      font: var(--mat-sys-label-small);
      cursor: pointer;
    }
    .position.circle {
      border-radius: 50%;
    }
    .position.used {
      background: var(--mat-sys-surface-container-highest);
      color: var(--mat-sys-on-surface-variant);
      text-decoration: line-through;
    }
    .position.start {
      background: var(--mat-sys-primary);
      color: var(--mat-sys-on-primary);
      font-weight: 700;
    }
    .legend {
      margin: 4px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StartPositionGrid {
  /** The sheet stock whose positions are shown. */
  readonly stock = input.required<SheetLabelStock>();
  /** The first position to print on, from 1 (top left), in reading order. */
  readonly start = model(1);

  protected readonly positions = computed(() =>
    labelPositions(this.stock()).map((b) => b.index + 1),
  );
  protected readonly round = computed(() => ['circle', 'oval'].includes(this.stock().shape.kind));
  /** Margins and gaps as shares of the page, so the drawing has the sheet's proportions. */
  protected readonly padding = computed(() => {
    const s = this.stock();
    const w = s.pageWidthMm;
    const pct = (mm: number) => `${(mm / w) * 100}%`;
    const right = w - s.leftMarginMm - (s.across - 1) * s.horizontalPitchMm - s.labelWidthMm;
    const bottom =
      s.pageHeightMm - s.topMarginMm - (s.down - 1) * s.verticalPitchMm - s.labelHeightMm;
    // Percentages of padding are of the width on every side.
    return [s.topMarginMm, right, bottom, s.leftMarginMm]
      .map((mm) => pct(Math.max(0, mm)))
      .join(' ');
  });
  protected readonly gapX = computed(() => {
    const s = this.stock();
    return ((s.horizontalPitchMm - s.labelWidthMm) / s.pageWidthMm) * 100;
  });
  protected readonly gapY = computed(() => {
    const s = this.stock();
    // A row gap's percentage is of the grid's height.
    return ((s.verticalPitchMm - s.labelHeightMm) / s.pageHeightMm) * 100;
  });

  protected label(p: number): string {
    const across = this.stock().across;
    const where = `row ${Math.ceil(p / across)}, column ${((p - 1) % across) + 1}`;
    return `Position ${p}, ${where}${p < this.start() ? ', used' : ''}`;
  }

  protected move(event: KeyboardEvent): void {
    const across = this.stock().across;
    const last = this.positions().length;
    const steps: Record<string, number> = {
      ArrowRight: 1,
      ArrowLeft: -1,
      ArrowDown: across,
      ArrowUp: -across,
    };
    let next: number;
    if (event.key === 'Home') next = 1;
    else if (event.key === 'End') next = last;
    else if (event.key in steps) next = this.start() + steps[event.key]!;
    else return;
    event.preventDefault();
    next = Math.min(last, Math.max(1, next));
    this.start.set(next);
    const grid = (event.currentTarget as HTMLElement).parentElement;
    queueMicrotask(() => grid?.querySelector<HTMLElement>(`[data-position="${next}"]`)?.focus());
  }
}
