// How long e-mailed links stay valid. Shared by the server (which enforces them) and the pages
// (which tell people), so it lives outside the server code.
export const INVITATION_DAYS = 7;
export const RESET_MINUTES = 60;
