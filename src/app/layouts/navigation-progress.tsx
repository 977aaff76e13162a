import { useNavigation } from 'react-router-dom';

/** A thin bar at the top of the window while the next page's code or data loads. */
export function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state === 'idle') return null;
  return <div aria-hidden="true" className="fixed inset-x-0 top-0 z-50 h-1 bg-ember motion-safe:animate-pulse" />;
}
