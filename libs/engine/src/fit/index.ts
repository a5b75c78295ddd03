// Basis fit: exact rational fits of level series to products ∏(q − s), checked on further levels.
export * from './rational';
export * from './basis-fit';
