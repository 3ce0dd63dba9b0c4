// The verification charts' colours, from the desk palette (src/styles/global.css).
export const INK = "#23275a";
export const GOLD = "#c47f12";
export const CALM = "#2f7d6d";
export const WARN = "#9a3412";
export const GRID = "#e6e1d6";
export const MUTED = "#9aa0b8";
