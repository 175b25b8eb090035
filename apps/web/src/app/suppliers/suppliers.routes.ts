import type { Routes } from '@angular/router';

/** The suppliers area (its pages are being built). */
const suppliersRoutes: Routes = [];

export default suppliersRoutes;
