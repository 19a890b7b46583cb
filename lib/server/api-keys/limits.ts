/** Input limits shared by the API schema, the console form and the command line. */
export const API_KEY_NAME_MAX_LENGTH = 100;
export const API_KEY_EXPIRES_DAYS_MAX = 3650;
/** Page size of GET /api/v1/api-keys. */
export const API_KEY_PAGE_DEFAULT = 25;
export const API_KEY_PAGE_MAX = 100;
