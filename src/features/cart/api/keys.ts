export const cartKeys = {
  all: ['cart'] as const,
  /** the cart of this viewer: a guest's and the signed-in user's carts are different carts */
  current: (viewer: string) => [...cartKeys.all, 'current', viewer] as const,
};
