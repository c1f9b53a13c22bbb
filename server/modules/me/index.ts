// The public face of the me module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { describeMe } from './me.service';
