import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { saveFile } from '../documents/save-file';
import { messageOf } from '../http/api-error';
import { LabelStocksApi } from './label-stocks-api';

/**
 * "Calibration page" for one stock: the label outlines and rulers as a PDF, to print at 100 % on
 * plain paper and hold against a sheet of labels before printing on it.
 */
@Component({
  selector: 'bp-calibration-download',
  imports: [MatButton, MatIcon],
  template: `
    <button
      mat-button
      type="button"
      [disabled]="busy()"
      [attr.aria-label]="'Calibration page for ' + name()"
      (click)="download()"
    >
      <mat-icon>straighten</mat-icon>Calibration page
    </button>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalibrationDownload {
  /** The stock's id (a built-in stock's key). */
  readonly stockId = input.required<string>();
  /** The stock's name, for the button's accessible name and the file's. */
  readonly name = input.required<string>();

  private readonly api = inject(LabelStocksApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly busy = signal(false);

  protected download(): void {
    this.busy.set(true);
    this.api.calibrationPdf(this.stockId()).subscribe({
      next: (pdf) => {
        this.busy.set(false);
        saveFile(pdf, `calibration-${fileSafe(this.name())}.pdf`);
        this.snackBar.open('Print the calibration page at actual size (100 %).', 'OK', {
          duration: 6000,
        });
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}

/** A name as a file name: letters, digits and dashes. */
export function fileSafe(name: string): string {
  return (
    name
      .normalize('NFKD')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'labels'
  );
}
