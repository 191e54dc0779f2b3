import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { RequestHandler } from 'express';
import type { Principal } from '../http/route';
import { JWT_AUDIENCE, JWT_ISSUER, secretKeyOf } from './tokens';

interface AccessClaims {
  sub: string;
  name: string;
  email: string;
  orgs: Principal['memberships'];
}

/** Register the JWT strategy: HS256 only (a token naming another algorithm, or none, is refused). */
export function configurePassport(secret: string): passport.PassportStatic {
  const instance = new passport.Passport();
  instance.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        // A KeyObject, made once (auth/tokens.ts): given a string, jsonwebtoken parses it on every request.
        secretOrKey: secretKeyOf(secret) as unknown as string,
        algorithms: ['HS256'],
        issuer: JWT_ISSUER,
        audience: JWT_AUDIENCE,
      },
      (claims: AccessClaims, done: (error: unknown, user?: Principal | false) => void) => {
        done(null, { userId: claims.sub, displayName: claims.name, email: claims.email, memberships: claims.orgs ?? [] });
      },
    ),
  );
  return instance as unknown as passport.PassportStatic;
}

/** Attach `req.principal` when a valid bearer token is present; never rejects by itself. */
export function identify(instance: passport.PassportStatic): RequestHandler {
  return (req, res, next) => {
    // "ApiKey <key>" is bench automation, handled by server/api-keys/identify-api-key.ts.
    if (!req.headers.authorization || /^ApiKey\s/i.test(req.headers.authorization)) return next();
    instance.authenticate('jwt', { session: false }, (error: unknown, user: Principal | false) => {
      if (error) return next(error);
      (req as { principal?: Principal | null }).principal = user || null;
      (req as { tokenRejected?: boolean }).tokenRejected = !user;
      next();
    })(req, res, next);
  };
}
