// What other features may use of the cart.
export { useCart, type CartLine } from './cart-store.ts';
export { clearCheckoutDetails, loadCheckoutDetails, saveCheckoutDetails } from './checkout-details.ts';
