import { type HarnessLoader, manualChangeDetection } from '@angular/cdk/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { Router } from '@angular/router';
import { expect, vi } from 'vitest';

/* Test-only helpers for leaving a page with unsaved changes (imported by specs only). */

/** Somewhere else to go. */
@Component({ selector: 'bp-elsewhere', template: '<p>Elsewhere</p>' })
export class Elsewhere {}

/** Starts leaving for `/elsewhere`; resolves when the navigation ends (true when it went ahead). */
export const leave = () => TestBed.inject(Router).navigateByUrl('/elsewhere');

/**
 * Answers the "Save your changes?" dialog with the button named `choice`. A navigation waiting
 * on its guard keeps the page from settling, so the harnesses here do not wait for it to.
 */
export function chooseOnLeaving(root: HarnessLoader, choice: RegExp): Promise<void> {
  return manualChangeDetection(async () => {
    const dialog = await vi.waitFor(() => root.getHarness(MatDialogHarness));
    expect(await dialog.getTitleText()).toBe('Save your changes?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: choice }))).click();
  });
}
