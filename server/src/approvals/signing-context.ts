import type { Request } from 'express';
import type { SigningContext } from './approvals.service';

/** Where a signature comes from: the client address (behind the loopback proxy) and its user agent. */
export function signingContextOf(req: Request): SigningContext {
  return { ipAddress: req.ip ?? req.socket.remoteAddress ?? 'unknown', userAgent: String(req.headers['user-agent'] ?? 'unknown').replace(/\u0000/g, '') };
}
