// Rock-mass ratings, tunnel kinematics and look-ahead (issue 4). Re-exports only.
export {};
