import { Navigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { browserToday } from '@/features/day-sheet/utils/browser-today';

/** The Day Sheet's own address in the navigation: today's sheet. */
export default function DaySheetTodayRoute() {
  return <Navigate to={paths.roastery.daySheet.getHref(browserToday())} replace />;
}
