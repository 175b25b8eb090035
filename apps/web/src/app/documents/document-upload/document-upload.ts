import { HttpEventType } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  type ElementRef,
  effect,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  DOCUMENT_MAX_BYTES,
  type DocumentKind,
  documentSchema,
  documentUploadSchema,
  type SupplierDocument,
} from '@batchproof/shared';
import {
  checkForm,
  errorMessage,
  showFieldErrors,
  showRequestError,
} from '../../forms/form-errors';
import { ApiError } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { DOCUMENT_KIND_OPTIONS, fileSize } from '../document-kinds';
import { DocumentsApi } from '../documents-api';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';

const MAX_SIZE_WORDS = fileSize(DOCUMENT_MAX_BYTES);

/** Plain words for the two refusals a file can meet on its way in. */
const REFUSALS: Partial<Record<number, string>> = {
  413: `This file is too large. The largest file Batchproof accepts is ${MAX_SIZE_WORDS}.`,
  415: 'This file is not a PDF, PNG or JPEG, whatever its name says. Save it as one of those and try again.',
};

/**
 * The form that uploads one supplier document (kind, title, issue date, version and the file)
 * onto a material or a lot. Shows upload progress and says plainly why a file was refused.
 */
@Component({
  selector: 'bp-document-upload',
  imports: [
    MatDatepickerModule,
    MatSuffix,
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
  ],
  // Dates typed and shown in the browser's locale, held as YYYY-MM-DD.
  providers: [provideCalendarDays()],
  templateUrl: './document-upload.html',
  styleUrl: './document-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DocumentUpload {
  /** The material the document belongs to (give this or `lotId`). */
  readonly materialId = input<string>();
  /** The lot the document belongs to (give this or `materialId`). */
  readonly lotId = input<string>();
  /** An older document this upload replaces (it stays on file as superseded history). */
  readonly replaces = input<SupplierDocument | null>(null);
  /** Emits each document once the API has stored it. */
  readonly uploaded = output<SupplierDocument>();

  private readonly api = inject(DocumentsApi);
  private readonly snackBar = inject(MatSnackBar);
  /** The Idempotency-Key of the upload, kept while the same file and fields are retried. */
  private readonly submission = new SubmissionKey();
  private readonly picker = viewChild.required<ElementRef<HTMLInputElement>>('picker');

  protected readonly form = inject(NonNullableFormBuilder).group({
    kind: 'sds' as DocumentKind,
    title: '',
    issuedOn: '',
    version: '',
    file: inject(NonNullableFormBuilder).control<File | null>(null),
  });
  protected readonly kinds = DOCUMENT_KIND_OPTIONS;
  protected readonly maxSize = MAX_SIZE_WORDS;
  protected readonly fileSize = fileSize;
  protected readonly errorMessage = errorMessage;
  protected readonly uploading = signal(false);
  /** Percent sent, or null while the browser does not report it. */
  protected readonly progress = signal<number | null>(null);
  protected readonly notice = signal('');
  protected readonly chosen = signal<File | null>(null);
  /** A replacement is of the same kind as the document it replaces. */
  private readonly sameKindAsReplaced = effect(() => {
    const old = this.replaces();
    if (old) this.form.controls.kind.setValue(old.kind);
  });

  protected choose(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0] ?? null;
    this.chosen.set(file);
    this.form.controls.file.setValue(file);
    this.form.controls.file.markAsTouched();
    if (file && file.size > DOCUMENT_MAX_BYTES) {
      showFieldErrors(this.form, { file: [REFUSALS[413]!] });
    }
    // Offer the file's name as the title when none is typed yet.
    if (file && !this.form.controls.title.value) {
      this.form.controls.title.setValue(file.name.replace(/\.[^.]+$/, ''));
    }
  }

  protected submit(): void {
    if (this.uploading()) return;
    this.notice.set('');
    const raw = this.form.getRawValue();
    const fileError = !raw.file
      ? 'Choose a PDF, PNG or JPEG file to upload'
      : raw.file.size > DOCUMENT_MAX_BYTES
        ? REFUSALS[413]!
        : null;
    const { value, notice } = checkForm(this.form, {
      schema: documentUploadSchema,
      body: {
        kind: raw.kind,
        title: raw.title,
        issuedOn: raw.issuedOn,
        version: raw.version,
        materialId: this.materialId(),
        lotId: this.lotId(),
        replacesId: this.replaces()?.id,
      },
      extra: fileError ? { file: [fileError] } : {},
    });
    this.notice.set(notice);
    if (value) this.send(value, raw.file!);
  }

  private send(fields: Parameters<DocumentsApi['upload']>[0], file: File): void {
    this.uploading.set(true);
    this.progress.set(null);
    this.api.upload(fields, file, this.submission.for({ fields, file })).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress && event.total) {
          this.progress.set(Math.round((event.loaded / event.total) * 100));
        } else if (event.type === HttpEventType.Response) {
          const doc = documentSchema.parse(event.body);
          this.uploading.set(false);
          this.submission.done();
          this.reset();
          this.snackBar.open(`Uploaded “${doc.title}”.`, 'OK', { duration: 4000 });
          this.uploaded.emit(doc);
        }
      },
      error: (err: unknown) => {
        this.uploading.set(false);
        this.notice.set(this.refusal(err));
      },
    });
  }

  /** The notice for a failed upload; a refused file also gets a short note beside the picker. */
  private refusal(err: unknown): string {
    const plain = err instanceof ApiError ? REFUSALS[err.status] : undefined;
    if (!plain || !(err instanceof ApiError)) return showRequestError(this.form, err);
    const beside =
      err.status === 413
        ? `Larger than ${MAX_SIZE_WORDS}`
        : (err.fieldErrors['file']?.[0] ?? 'Upload a PDF, PNG or JPEG file');
    showFieldErrors(this.form, { file: [beside] });
    return plain;
  }

  private reset(): void {
    this.form.reset();
    this.chosen.set(null);
    this.picker().nativeElement.value = '';
  }
}
