import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import {
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
import { MatTab, MatTabGroup } from '@angular/material/tabs';
import { firstValueFrom } from 'rxjs';

import type { CreateSourceBody } from '@contracts/sources/sources-schemas';
import { readableMessage } from '../../core/api-error';
import { SourcesApi, type AddedSource } from '../sources-api';
import { cslFromFields } from './csl-from-fields';

/** The ways a source can be entered, in tab order. */
export const ENTRY_TABS = ['doi', 'bibtex', 'ris', 'fields'] as const;
export type EntryTab = (typeof ENTRY_TABS)[number];

const text = (required = false) =>
  new FormControl('', { nonNullable: true, validators: required ? [Validators.required] : [] });

/**
 * Adds a source by DOI, pasted BibTeX or RIS, or fields typed by hand. Closes with the
 * `AddedSource` (the existing source when its DOI is already registered), or undefined.
 */
@Component({
  selector: 'thalpos-add-source-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogTitle,
    MatDialogContent,
    MatDialogActions,
    MatDialogClose,
    MatButton,
    MatTabGroup,
    MatTab,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatSelect,
    MatOption,
    MatProgressBar,
  ],
  templateUrl: './add-source-dialog.html',
  styleUrl: './add-source-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AddSourceDialog {
  private readonly api = inject(SourcesApi);
  private readonly dialog = inject<MatDialogRef<AddSourceDialog, AddedSource>>(MatDialogRef);

  protected readonly tab = signal(0);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected readonly types = [
    { value: 'article-journal', label: 'Journal article' },
    { value: 'book', label: 'Book' },
    { value: 'chapter', label: 'Book chapter' },
    { value: 'report', label: 'Report' },
    { value: 'dataset', label: 'Data set' },
    { value: 'thesis', label: 'Thesis' },
    { value: 'webpage', label: 'Web page' },
    { value: 'document', label: 'Other' },
  ] as const;

  protected readonly doi = text(true);
  protected readonly bibtex = text(true);
  protected readonly ris = text(true);
  protected readonly fields = new FormGroup({
    type: new FormControl('article-journal', { nonNullable: true }),
    title: text(true),
    authors: text(),
    year: new FormControl('', { nonNullable: true, validators: [Validators.pattern(/^\d{4}$/)] }),
    container: text(),
    volume: text(),
    issue: text(),
    pages: text(),
    publisher: text(),
    doi: text(),
    url: text(),
  });

  protected async add(): Promise<void> {
    const entry = ENTRY_TABS[this.tab()] ?? 'doi';
    const body = this.body(entry);
    if (!body) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      this.dialog.close(await firstValueFrom(this.api.create(body)));
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.busy.set(false);
    }
  }

  /** The request body of the open tab, or null (with the fields marked) when it is incomplete. */
  private body(entry: EntryTab): CreateSourceBody | null {
    const control = { doi: this.doi, bibtex: this.bibtex, ris: this.ris, fields: this.fields }[
      entry
    ];
    if (control.invalid) {
      control.markAllAsTouched();
      return null;
    }
    switch (entry) {
      case 'doi':
        return { doi: this.doi.value.trim() };
      case 'bibtex':
        return { bibtex: this.bibtex.value };
      case 'ris':
        return { ris: this.ris.value };
      case 'fields':
        return { csl: cslFromFields(this.fields.getRawValue()) as CreateSourceBody['csl'] };
    }
  }
}
