// Record ids are UUIDs (PostgreSQL gen_random_uuid()); the one pattern the server checks them by.
const uuid = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const wholeUuid = new RegExp(`^${uuid}$`, 'i');

/** Whether the text is exactly a record id. */
export const isUuid = (text: string) => wholeUuid.test(text);
