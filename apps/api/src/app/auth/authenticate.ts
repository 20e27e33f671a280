import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { unauthorized } from '../http/http-error';
import { JWT_ALGORITHM, type AccessTokenClaims } from './access-token';
import { findUserById, publicUser } from './users.service';

/**
 * Builds the bearer-token check for one app instance (its own Passport, so test apps with
 * different secrets never share state). The person is looked up on every request, so a
 * disabled account or a changed role takes effect at once rather than when the token expires.
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
          .then((user) => done(null, user && !user.disabled ? publicUser(user) : false))
          .catch(done);
      },
    ),
  );
  return (req, res, next) => {
    // A custom callback so a failure becomes our JSON 401 instead of passport's plain-text one.
    passport.authenticate('jwt', { session: false }, (error: unknown, user: Express.User | false) => {
      if (error) return next(error);
      if (!user) return next(unauthorized());
      req.user = user;
      next();
    })(req, res, next);
  };
}
