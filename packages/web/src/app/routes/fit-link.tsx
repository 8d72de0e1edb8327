import { Navigate, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';

/** The link e-mails give for a fit (`paths.fit`): the desk's Fits section, opened on that fit. */
export function FitLinkRoute() {
  const { eventId = '', fitId = '' } = useParams();
  return <Navigate to={paths.eventSection(eventId, 'fits', fitId)} replace />;
}
