import { Router } from 'express';
import {
  changePasswordSchema,
  confirmSignupSchema,
  forgotPasswordSchema,
  loginSchema,
  profileUpdateSchema,
  resetPasswordSchema,
  signupSchema,
} from '@basinwright/common';
import { guard } from '../../middlewares/auth';
import type { RateLimits } from '../../middlewares/rate-limit';
import { validate } from '../../middlewares/validate';
import * as controller from './auth.controller';

export function authRouter(limits: RateLimits): Router {
  const router = Router();
  router.post('/signup', limits.signupByIp, validate(signupSchema), controller.signup);
  router.post(
    '/signup/confirm',
    limits.tokenByIp,
    validate(confirmSignupSchema),
    controller.confirmSignup,
  );
  // Per IP before validation (counts every try); guesses per account and address are
  // throttled in the service (auth.throttle.ts), which knows whether the password was right.
  router.post('/login', limits.loginByIp, validate(loginSchema), controller.login);
  router.post('/logout', guard('session.end'), controller.logout);
  router.get('/me', guard('session.read'), controller.me);
  router.patch('/me', guard('profile.update'), validate(profileUpdateSchema), controller.updateMe);
  // Rate-limited like the token routes: it checks a password.
  router.post(
    '/change-password',
    limits.tokenByIp,
    guard('password.change'),
    validate(changePasswordSchema),
    controller.changePassword,
  );
  router.post(
    '/forgot-password',
    limits.forgotByIp,
    validate(forgotPasswordSchema),
    limits.forgotByAccount,
    controller.forgotPassword,
  );
  router.post(
    '/reset-password',
    limits.tokenByIp,
    validate(resetPasswordSchema),
    controller.resetPassword,
  );
  return router;
}
