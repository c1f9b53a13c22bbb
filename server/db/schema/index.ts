export * from './auth';
export * from './companies';
export * from './records';
export * from './catalog';
export * from './water';
export * from './tags';
export * from './photos';
export * from './share-links';
