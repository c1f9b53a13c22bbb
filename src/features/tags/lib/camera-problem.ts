/** Plain words for why the camera did not start, and what to do instead. */
export function cameraUnavailableReason(): string | null {
  if (!window.isSecureContext) {
    return 'The camera only works on a secure connection: open Lifeplate over https (or on localhost on this device). Type the code or decode a photo below instead.';
  }
  if (!navigator.mediaDevices?.getUserMedia) return 'This browser cannot use the camera here. Type the code or decode a photo below instead.';
  return null;
}

export function describeCameraError(error: unknown): string {
  const name = error instanceof DOMException || error instanceof Error ? error.name : '';
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return 'Camera permission was refused. Allow the camera for this site in the browser settings, then tap “Start the camera”, or type the code below.';
    case 'NotFoundError':
    case 'OverconstrainedError':
      return 'No camera was found on this device. Type the code or decode a photo below instead.';
    case 'NotReadableError':
    case 'AbortError':
      return 'The camera is busy in another app. Close that app, then tap “Start the camera”.';
    default:
      return `The camera did not start${error instanceof Error && error.message ? ` (${error.message})` : ''}. Type the code or decode a photo below instead.`;
  }
}
