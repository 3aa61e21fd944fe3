/**
 * The desktop application: JavaFX views and their view-models. No physics lives here; every
 * number shown comes from {@link halfrail.check.DesignAnalysis} and the check layer's studies
 * (supply sweep, Monte Carlo, divider trade-off) or {@link halfrail.convert.Converter}, called through an injected
 * {@link halfrail.ui.AnalysisExecutor} so that the FX thread never runs an analysis.
 *
 * <h2>Structure</h2>
 * <ul>
 *   <li>{@link halfrail.ui.WorkbenchModel} — the main view-model: the design, its latest report,
 *       the edit history ({@link halfrail.ui.EditHistory}), the supply trial, the status line; it
 *       owns the panels' view-models and links them (a selected finding spotlights its ladder
 *       level, its editor fields and its block in the chain drawing).</li>
 *   <li>Per panel a view-model and a view: {@link halfrail.ui.EditorPanelModel} /
 *       {@link halfrail.ui.EditorPanel}, {@link halfrail.ui.LadderPanelModel} /
 *       {@link halfrail.ui.LadderPanel} with {@link halfrail.ui.LadderCanvas},
 *       {@link halfrail.ui.FindingsPanelModel} / {@link halfrail.ui.FindingsPanel},
 *       {@link halfrail.ui.ReadingsPanelModel} / {@link halfrail.ui.ReadingsPanel},
 *       {@link halfrail.ui.ChainPanelModel} / {@link halfrail.ui.ChainCanvas}, and
 *       {@link halfrail.ui.SupplyTrialBar} on the main view-model; the plots
 *       {@link halfrail.ui.HeadroomSweepModel} / {@link halfrail.ui.HeadroomChart},
 *       {@link halfrail.ui.ReportPlotsModel} / {@link halfrail.ui.PowerOnChart} and {@link halfrail.ui.ResponseChart},
 *       {@link halfrail.ui.DividerTradeoffModel} / {@link halfrail.ui.DividerTradeoffChart};
 *       {@link halfrail.ui.MonteCarloModel} / {@link halfrail.ui.MonteCarloPanel} with {@link halfrail.ui.HistogramCanvas};
 *       {@link halfrail.ui.ConversionModel} / {@link halfrail.ui.ConversionDialog}.</li>
 *   <li>{@link halfrail.ui.RecoveryStore} keeps unsaved work in a recovery file (plain class, no toolkit).</li>
 *   <li>Drawn views keep geometry and hit-testing in plain classes
 *       ({@link halfrail.ui.LadderGeometry}, {@link halfrail.ui.ChainGeometry}, {@link halfrail.ui.HistogramGeometry}); the canvases only paint.</li>
 *   <li>{@link halfrail.ui.HalfrailApp} is the JavaFX application; {@link halfrail.ui.AppLauncher}
 *       is the bridge the command-line launcher calls (JavaFX sits on the class path).</li>
 *   <li>Design files plug in through {@link halfrail.ui.DesignFileActions}
 *       ({@link halfrail.ui.HalfrailApp#useFileActions}); without one, open and save stay disabled.</li>
 * </ul>
 */
package halfrail.ui;
