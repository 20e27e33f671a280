import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { ownerOfApiToken } from '../tokens/api-tokens.service';
import { unauthorized } from '../http/http-error';
import { JWT_ALGORITHM, tokenIssuedAtMs, type AccessTokenClaims } from './access-token';
import { API_TOKEN_PREFIX } from '../identity/token-hash';
import { findUserById, publicUser } from '../identity/users.service';

/**
 * Builds the bearer check for one app instance (its own Passport, so test apps with different
 * secrets never share state). A bearer starting with `tf_` is a personal API token and acts with
 * its owner's role; anything else must be a signed access JWT. The person is looked up on every
 * request, so a disabled account, a changed role, a sign-out or a password change (which end the
 * access tokens issued before them) take effect at once, on every server sharing the database.
 */
export function createAuthenticate(db: Knex, jwtSecret: string): RequestHandler {
  const passport = new Passport();
  passport.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: jwtSecret,
        algorithms: [JWT_ALGORITHM],
        issuer: 'tallyfit',
      },
      (claims: AccessTokenClaims, done: (error: unknown, user?: Express.User | false) => void) => {
        findUserById(db, Number(claims.sub))
          .then((user) => {
            const current = user && !user.disabled && tokenIssuedAtMs(claims) >= (user.sessionsValidAfterMs ?? 0);
            done(null, current ? publicUser(user) : false);
          })
          .catch(done);
      },
    ),
  );
  const bearerOf = ExtractJwt.fromAuthHeaderAsBearerToken();
  return (req, res, next) => {
    const bearer = bearerOf(req);
    if (bearer?.startsWith(API_TOKEN_PREFIX)) {
      ownerOfApiToken(db, bearer)
        .then((owner) => {
          if (!owner) return next(unauthorized('the API token is unknown or revoked'));
          req.user = publicUser(owner);
          next();
        })
        .catch(next);
      return;
    }
    // A custom callback so a failure becomes our JSON 401 instead of passport's plain-text one.
    passport.authenticate('jwt', { session: false }, (error: unknown, user: Express.User | false) => {
      if (error) return next(error);
      if (!user) return next(unauthorized());
      req.user = user;
      next();
    })(req, res, next);
  };
}
