/**
 * Every view that needs the data layer (the zod schemas, react-hook-form, FlashList, fuse.js) in one
 * module, reached only through `deferred()` (./deferred.tsx). Metro then bundles all of it as one
 * chunk fetched when such a view is first shown: a module imported by two route chunks would otherwise
 * land in the shared chunk that the landing page and Check download before they can render.
 * Check, the landing page and the shell must not import these modules directly.
 */
export { AcceptInvitationScreen } from '@/components/account/accept-invitation-screen';
export { AccountScreen } from '@/components/account/account-screen';
export { ForgotPasswordScreen } from '@/components/account/forgot-password-screen';
export { GroupScreen } from '@/components/account/group-screen';
export { ResetPasswordScreen } from '@/components/account/reset-password-screen';
export { SignInScreen } from '@/components/account/sign-in-screen';
export { SignUpScreen } from '@/components/account/sign-up-screen';
export { VerifyScreen } from '@/components/account/verify-screen';
export { LibraryMeasuredCard } from '@/components/check/library-measured-card';
export { ImportScreen } from '@/components/exchange/import-screen';
export { LandingActivity } from '@/components/home/landing-activity';
export { ComplexDetailView } from '@/components/library/complex-detail';
export { ComplexFormScreen } from '@/components/library/complex-form';
export { LibraryScreen } from '@/components/library/library-screen';
export { ReviewQueueScreen } from '@/components/review/review-queue-screen';
export { RouteScreen } from '@/components/route/route-screen';
