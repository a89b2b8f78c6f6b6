export * from './ease';
export * from './bust-dart';
export * from './block-frame';
export * from './block-front';
export * from './block-back';
export * from './block-draft';
export * from './under-structure';
