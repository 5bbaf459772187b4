export * from './auth';
export * from './companies';
export * from './projects';
export * from './bid-items';
export * from './audit';
