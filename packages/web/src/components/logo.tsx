import { PRODUCT_NAME } from '@/config/product';

// Our mark: a dark body whose lit limb shows as a thin crescent, crossed by a tilted ring arc that is
// offset from the disc, as a ring seen at an opening angle would be.
export function LimbusLogo({ sizePx = 32, decorative = false }: { sizePx?: number; decorative?: boolean }) {
  return (
    <svg
      width={sizePx}
      height={sizePx}
      viewBox="0 0 64 64"
      role={decorative ? undefined : 'img'}
      aria-hidden={decorative ? true : undefined}
      aria-label={decorative ? undefined : `${PRODUCT_NAME} logo`}
    >
      <circle cx="30" cy="34" r="18" fill="#0b2a33" />
      <path
        d="M 16 22 A 18 18 0 0 1 46 26"
        fill="none"
        stroke="#7fd1c7"
        strokeWidth="2.5"
        strokeLinecap="round"
      />
      <ellipse
        cx="32"
        cy="32"
        rx="29"
        ry="8"
        transform="rotate(-24 32 32)"
        fill="none"
        stroke="#e0a458"
        strokeWidth="2"
        strokeDasharray="70 14"
      />
    </svg>
  );
}
