import type { Routes } from '@angular/router';

export default [] satisfies Routes;
