import { Navigate } from 'react-router-dom';
import { useMe } from '../features/auth/api/get-me';
import { navScreens, landingScreenByRole, screens } from './screens';

/** "/" sends each user to their role's main screen, or else the first screen they may open. */
export function HomeRedirect() {
  const { data: me } = useMe();
  if (!me) return null;

  const permitted = (action: string) => me.permissions.includes(action);
  const landing = screens[landingScreenByRole[me.role]];
  const target = permitted(landing.action) ? landing : navScreens.find((screen) => permitted(screen.action));

  if (!target) {
    return <p className="text-graphite-700">Your role ({me.role}) has no screens in Fluxtrail yet. Ask your Fluxtrail admin.</p>;
  }
  return <Navigate to={target.path} replace />;
}
