import type { Routes } from '@angular/router';

/** The materials area (its pages are being built). */
const materialsRoutes: Routes = [];

export default materialsRoutes;
