export * from './calibrator-tone';
export * from './microphone-sensitivity';
export * from './loudspeaker-sensitivity';
export * from './headphone-sensitivity';
