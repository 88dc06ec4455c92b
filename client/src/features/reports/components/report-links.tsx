import type { ProfileVersion, Role } from '@keyloom/shared';
import { Link } from 'react-router-dom';
import { clientReportPath, versionReportPath } from '@/config/paths';
import { hasModel } from '@/features/keyboard/logic/keyboard-versions';

const linkClasses = 'inline-flex min-h-11 items-center font-bold underline';
/** Roles that print reports (the API answers carers and admins 403). */
const PRINTS: readonly Role[] = ['clinician', 'supervisor'];

/** "Report for printing" on a trained version's page, for clinicians and supervisors. */
export const VersionReportLink = ({
  clientId,
  version,
  role,
}: {
  clientId: string;
  version: Pick<ProfileVersion, 'id' | 'status' | 'number'>;
  role: Role;
}) =>
  PRINTS.includes(role) && hasModel(version) ? (
    <Link to={versionReportPath(clientId, version.id)} className={linkClasses}>
      Report for printing
    </Link>
  ) : null;

/** "Client report" on a client's page (the last 90 days), for clinicians and supervisors. */
export const ClientReportLink = ({ clientId, role }: { clientId: string; role: Role }) =>
  PRINTS.includes(role) ? (
    <Link to={clientReportPath(clientId)} className={linkClasses}>
      Client report
    </Link>
  ) : null;
