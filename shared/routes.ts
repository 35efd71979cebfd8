/**
 * Every address of the product in one place: the pages the client routes to and the links the
 * server puts in e-mails, audit lines, payment sessions and JSON answers. Paths only; the server
 * puts `APP_URL` in front where a link leaves the app (`absolute`).
 */
const seg = encodeURIComponent;

/** Etchwell's own pages and the links its e-mails carry. */
export const platformPaths = {
  signIn: '/sign-in',
  myOrders: '/account/orders',
  invite: (token: string) => `/invites/${seg(token)}`,
  /** The address-confirmation link: the API confirms, then sends the browser on. */
  confirmEmail: (token: string) => `/api/accounts/verify-email?token=${seg(token)}`,
};

/** A buyer's pages in a studio's storefront. */
export const storefrontPaths = {
  home: (studio: string) => `/s/${seg(studio)}`,
  blank: (studio: string, blankId: string) => `/s/${seg(studio)}/blanks/${seg(blankId)}`,
  cart: (studio: string) => `/s/${seg(studio)}/cart`,
  /** The order page; `key` is the private link's key, left out for a signed-in buyer. */
  order: (studio: string, orderId: string, key?: string) => `/s/${seg(studio)}/orders/${seg(orderId)}${key ? `?key=${seg(key)}` : ''}`,
  proof: (studio: string, token: string) => `/s/${seg(studio)}/proofs/${seg(token)}`,
  replacement: (studio: string, token: string) => `/s/${seg(studio)}/replace/${seg(token)}`,
};

/** A studio's workspace pages. */
export const workspacePaths = {
  home: (studio: string) => `/studio/${seg(studio)}`,
  order: (studio: string, orderId: string) => `/studio/${seg(studio)}/orders/${seg(orderId)}`,
  team: (studio: string) => `/studio/${seg(studio)}/team`,
  settings: (studio: string) => `/studio/${seg(studio)}/settings`,
  blank: (studio: string, blankId: string) => `/studio/${seg(studio)}/catalog/blanks/${seg(blankId)}`,
  recipes: (studio: string) => `/studio/${seg(studio)}/catalog/recipes`,
};

/** Files the API serves for pages: photos, previews, proofs and logos. */
export const assetPaths = {
  blankPhoto: (studio: string, photoId: string) => `/api/storefront/${seg(studio)}/photos/${seg(photoId)}`,
  workspaceBlankPhoto: (studio: string, photoId: string) => `/api/studios/${seg(studio)}/catalog/photos/${seg(photoId)}`,
  buyerPhotoPreview: (studio: string, photoId: string) => `/api/storefront/${seg(studio)}/buyer-photos/${seg(photoId)}/preview`,
  buyerPhotoThumb: (studio: string, photoId: string) => `/api/storefront/${seg(studio)}/buyer-photos/${seg(photoId)}/thumb`,
  buyerPhotoOriginal: (studio: string, photoId: string) => `/api/studios/${seg(studio)}/orders/photos/${seg(photoId)}/original`,
  proofImage: (studio: string, token: string) => `/api/storefront/${seg(studio)}/proofs/${seg(token)}/image`,
  logo: (studio: string, version: string) => `/api/storefront/${seg(studio)}/logo?v=${seg(version)}`,
};

/** A path made into a link that works outside the app (e-mails, the payment page). */
export const absolute = (appUrl: string, path: string) => `${appUrl.replace(/\/$/, '')}${path}`;
