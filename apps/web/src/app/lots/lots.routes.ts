import type { Routes } from '@angular/router';

/** The lots area (its pages are being built). */
const lotsRoutes: Routes = [];

export default lotsRoutes;
