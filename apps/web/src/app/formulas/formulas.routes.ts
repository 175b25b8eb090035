import type { Routes } from '@angular/router';

/** The formulas area (its pages are being built). */
const formulasRoutes: Routes = [];

export default formulasRoutes;
