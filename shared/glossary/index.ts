/** The words people read, in one place: every screen, e-mail and PDF takes its names from here. */
export * from './labels';
export * from './outcomes';
export * from './part-names';
export * from './quick-reasons';
export * from './visit-steps';
export * from './words';
export * from './result-words';
export * from './share-links';
