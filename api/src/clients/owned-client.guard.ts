import {
  BadRequestException,
  type CanActivate,
  type ExecutionContext,
  Injectable,
  UnauthorizedException,
} from '@nestjs/common';
import type { Request } from 'express';
import { NO_SESSION_MESSAGE } from '../auth/session-user';
import { ClientAccessService } from './client-access.service';

/** What Nest's ParseUUIDPipe answers for an id that is not a uuid (the same 400 before and after). */
export const NOT_A_UUID_MESSAGE = 'Validation failed (uuid is expected)';
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Route guard for uploads to `clients/:id/…`: only the client's owning clinician gets past it (403 for
 * another role, 404 for a client out of sight). Guards run after middleware and before interceptors
 * (NestJS documentation, "Guards": "Guards are executed after all middleware, but before any
 * interceptor or pipe"), so a refused upload is answered before multer reads a byte of its body.
 * The service checks again inside its transaction.
 */
@Injectable()
export class OwnedClientGuard implements CanActivate {
  constructor(private readonly access: ClientAccessService) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const request = context.switchToHttp().getRequest<Request>();
    if (!request.user) throw new UnauthorizedException(NO_SESSION_MESSAGE);
    const clientId = String(request.params.id ?? '');
    if (!UUID.test(clientId)) throw new BadRequestException(NOT_A_UUID_MESSAGE);
    await this.access.requireOwned(request.user, clientId);
    return true;
  }
}
