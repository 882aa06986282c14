package org.ritzwerk.engine.calibrate;

import java.util.Objects;
import java.util.function.DoubleUnaryOperator;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Peaks found on a detector (pixel positions) put on the wavelength axis of a dispersion
 * solution, for identification or a peak file: for a peak at pixel c with standard uncertainty
 * sigma_c,
 * <pre>
 *   lambda       = lambda(c)
 *   sigma_lambda = sqrt((lambda'(c) sigma_c)^2 + sigma_fit(c)^2)
 *   FWHM_lambda  = |lambda'(c)| FWHM_c
 * </pre>
 * with lambda(c) the solution's polynomial, lambda'(c) its slope and sigma_fit(c) the
 * standard uncertainty of the solution itself at c (0 where the solution carries no
 * covariance): first-order propagation of independent uncertainties (common practice, as in
 * the ISO Guide to the Expression of Uncertainty in Measurement). Wavelengths are in nm in the
 * solution's medium. Immutable and thread-safe (arrays are copied out).
 */
public final class CalibratedPeaks {

    private final double[] nm;
    private final double[] sigmaNm;
    private final double[] fwhmNm;
    private final double[] dispersion;
    private final double[] flux;
    private final double[] fluxSigma;
    private final Medium medium;

    private CalibratedPeaks(double[] nm, double[] sigmaNm, double[] fwhmNm, double[] dispersion, double[] flux,
            double[] fluxSigma, Medium medium) {
        this.nm = nm;
        this.sigmaNm = sigmaNm;
        this.fwhmNm = fwhmNm;
        this.dispersion = dispersion;
        this.flux = flux;
        this.fluxSigma = fluxSigma;
        this.medium = medium;
    }

    /**
     * @param peaks    peaks found on the detector
     * @param solution the detector's dispersion solution
     * @return the peaks on its wavelength axis
     */
    public static CalibratedPeaks of(Peaks peaks, DispersionSolution solution) {
        Objects.requireNonNull(solution, "solution");
        return of(peaks, solution, solution::wavelengthSigmaAt);
    }

    /**
     * The peaks on a solution's wavelength axis with the solution's uncertainty taken from
     * sigmaAt (nm at a pixel): the calibration's own search uses the covariance alone
     * ({@link DispersionSolution#covarianceSigmaAt}), which its windows were tuned with.
     */
    static CalibratedPeaks of(Peaks peaks, DispersionSolution solution, DoubleUnaryOperator sigmaAt) {
        Objects.requireNonNull(peaks, "peaks");
        Objects.requireNonNull(solution, "solution");
        int n = peaks.size();
        double[] nm = new double[n];
        double[] sigma = new double[n];
        double[] fwhm = new double[n];
        double[] dispersion = new double[n];
        double[] flux = new double[n];
        double[] fluxSigma = new double[n];
        for (int k = 0; k < n; k++) {
            double c = peaks.centre(k);
            double slope = solution.dispersionAt(c);
            double fromSolution = sigmaAt.applyAsDouble(c);
            nm[k] = solution.wavelengthAt(c);
            sigma[k] = Math.hypot(slope * peaks.centreSigma(k), Double.isNaN(fromSolution) ? 0 : fromSolution);
            fwhm[k] = Math.abs(slope) * peaks.fwhm(k);
            dispersion[k] = slope;
            flux[k] = peaks.flux(k);
            fluxSigma[k] = peaks.fluxSigma(k);
        }
        return new CalibratedPeaks(nm, sigma, fwhm, dispersion, flux, fluxSigma, solution.medium());
    }

    /** @return the number of peaks */
    public int size() {
        return nm.length;
    }

    /** @return the peaks' wavelengths, nm in {@link #medium()} */
    public double[] wavelengthsNm() {
        return nm.clone();
    }

    /** @return their standard uncertainties, nm */
    public double[] wavelengthSigmasNm() {
        return sigmaNm.clone();
    }

    /** @return the peaks' FWHMs, nm */
    public double[] fwhmsNm() {
        return fwhmNm.clone();
    }

    /**
     * @return the solution's dispersion lambda'(c) at each peak, nm per pixel (negative where the
     *         wavelength falls with pixel)
     */
    public double[] dispersionsNmPerPixel() {
        return dispersion.clone();
    }

    /**
     * @param floor the smallest flux to give, for formats and jobs that need positive
     *              intensities (a peak found on noise may have a flux at or below zero)
     * @return the peaks' fluxes (counts), each at least {@code floor}
     */
    public double[] fluxes(double floor) {
        double[] out = new double[flux.length];
        for (int k = 0; k < out.length; k++) {
            out[k] = Math.max(flux[k], floor);
        }
        return out;
    }

    /** @return the fluxes' standard uncertainties (counts), as the peak finder gave them */
    public double[] fluxSigmas() {
        return fluxSigma.clone();
    }

    /** @return the wavelengths' medium, the solution's */
    public Medium medium() {
        return medium;
    }

    /**
     * @param fluxFloor as for {@link #fluxes(double)}; at least 0
     * @return the peaks as a peak list for identification (nm in the medium, fluxes as intensities)
     */
    public PeakList toPeakList(double fluxFloor) {
        return PeakList.of(nm, sigmaNm, fluxes(fluxFloor), Unit.NANOMETRE, medium);
    }
}
