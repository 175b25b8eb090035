import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  inject,
  input,
  linkedSignal,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { MatAnchor } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { DomSanitizer, type SafeResourceUrl } from '@angular/platform-browser';
import { concat, EMPTY, exhaustMap, filter, of, switchMap, takeWhile, tap, timer } from 'rxjs';
import type { LabelRunRecord } from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { fileSafe } from '../calibration-download';
import { LabelRunsApi } from '../label-runs-api';

/** How often a rendering run is asked for its progress. */
export const POLL_MS = 400;

/**
 * A print run after it is recorded: a progress bar while its PDF renders (the run is read again
 * every {@link POLL_MS} ms), then the PDF in the page with the reminder to print at actual size,
 * a download link and, when the run has one, its public ingredients page. The PDF needs the
 * bearer token, so it is fetched and shown from an object URL.
 */
@Component({
  selector: 'bp-run-preview',
  imports: [DecimalPipe, MatAnchor, MatIcon, MatProgressBar],
  template: `
    @let r = current();
    <section class="preview" aria-labelledby="preview-heading">
      <h2 id="preview-heading">
        {{ r.labelCount | number }} {{ r.labelCount === 1 ? 'label' : 'labels' }} on
        {{ r.pageCount | number }} {{ r.pageCount === 1 ? 'page' : 'pages' }}
      </h2>
      @if (r.status === 'rendering') {
        <p aria-live="polite">
          Laying out labels: {{ r.progress.done | number }} of {{ r.progress.total | number }}
        </p>
        <mat-progress-bar
          mode="determinate"
          [value]="percent()"
          aria-label="Laying out the labels"
        />
      } @else if (r.status === 'failed') {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>The PDF could not be made. Try
          printing again; if it fails again, tell us which formula and stock you chose.
        </p>
      }
      @if (error()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ error() }}
        </p>
      }
      @if (pdfUrl(); as url) {
        <p class="actual-size" role="note">
          <mat-icon aria-hidden="true">straighten</mat-icon>
          <strong>Print at actual size (100 %).</strong> Turn off "Fit to page" or "Shrink to fit"
          in the print dialog, or the labels will not line up with the stock.
        </p>
        <div class="links">
          <a mat-flat-button [href]="url.raw" [attr.download]="fileName()">
            <mat-icon>download</mat-icon>Download the PDF
          </a>
          @if (r.publicPage && !r.publicPage.withdrawnAt) {
            <a mat-stroked-button [href]="r.publicPage.path" target="_blank" rel="noopener">
              <mat-icon>public</mat-icon>Public ingredients page
            </a>
          }
        </div>
        <iframe class="pdf" [src]="url.safe" [title]="'Labels PDF of ' + r.formulaName"></iframe>
      }
    </section>
  `,
  styles: `
    .preview {
      display: grid;
      gap: 12px;
    }
    h2 {
      margin: 0;
      font: var(--mat-sys-title-large);
    }
    .actual-size {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      margin: 0;
      padding: 12px 16px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .links {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
    }
    .pdf {
      width: 100%;
      height: 80vh;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunPreview {
  /** The run as the API answered its creation. */
  readonly run = input.required<LabelRunRecord>();

  private readonly api = inject(LabelRunsApi);
  private readonly sanitizer = inject(DomSanitizer);
  /** The run as last read. */
  protected readonly current = linkedSignal(() => this.run());
  protected readonly pdfUrl = signal<{ raw: string; safe: SafeResourceUrl } | null>(null);
  protected readonly error = signal('');
  protected readonly percent = computed(() => {
    const { done, total } = this.current().progress;
    return total > 0 ? (done / total) * 100 : 0;
  });
  protected readonly fileName = computed(() => {
    const r = this.current();
    return `labels-${fileSafe(r.formulaName)}-v${r.version}${r.lotCode ? `-${fileSafe(r.lotCode)}` : ''}.pdf`;
  });

  constructor() {
    toObservable(this.run)
      .pipe(
        switchMap((run) =>
          concat(
            of(run),
            run.status !== 'rendering'
              ? EMPTY
              : timer(POLL_MS, POLL_MS).pipe(
                  exhaustMap(() => this.api.run(run.id)),
                  takeWhile((r) => r.status === 'rendering', true),
                ),
          ),
        ),
        tap((run) => this.current.set(run)),
        filter((run) => run.status === 'ready'),
        switchMap((run) => this.api.pdf(run.id)),
        takeUntilDestroyed(),
      )
      .subscribe({
        next: (pdf) => this.show(pdf),
        error: (err: unknown) => this.error.set(messageOf(err)),
      });
    inject(DestroyRef).onDestroy(() => this.revoke());
  }

  private show(pdf: Blob): void {
    this.revoke();
    const raw = URL.createObjectURL(new Blob([pdf], { type: 'application/pdf' }));
    this.pdfUrl.set({ raw, safe: this.sanitizer.bypassSecurityTrustResourceUrl(raw) });
  }

  private revoke(): void {
    const url = this.pdfUrl();
    if (url) URL.revokeObjectURL(url.raw);
  }
}
