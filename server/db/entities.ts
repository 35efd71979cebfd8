import { Studio } from '../features/studios/studio.entity.ts';

/** Every entity the ORM knows, listed by hand: discovery by folder scan needs compiled files. */
export const entities = [Studio];
