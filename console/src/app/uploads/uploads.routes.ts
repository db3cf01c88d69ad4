import { areaComingRoutes } from '../shared/area-coming/area-coming-routes';

export const uploadsRoutes = areaComingRoutes('uploads');
