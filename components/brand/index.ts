export { Logo, LogoMark, type LogoProps, type LogoMarkProps } from "./logo";
