import type { Routes } from '@angular/router';
import type { AreaPath } from '../../core/areas';

/** Routes for an area whose pages are not built yet: one lazily loaded placeholder page. */
export function areaComingRoutes(area: AreaPath): Routes {
  return [
    {
      path: '',
      loadComponent: () => import('./area-coming').then((m) => m.AreaComing),
      data: { area },
    },
  ];
}
