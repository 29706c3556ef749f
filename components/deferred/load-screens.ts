/**
 * The one place that fetches the deferred chunk. On the web Metro turns this import() into a script
 * download that is fetched again after a failure, which is what "Try again" relies on.
 */
export const loadScreens = () => import('./screens');
