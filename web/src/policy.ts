// Who may do what: the server's own table, shared through @basinwright/common.
export { can, POLICY, type Action } from '@basinwright/common';
