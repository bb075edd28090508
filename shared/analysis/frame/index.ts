export { analyzeFrame, type AnalyzeFrameOptions, type AnalysisStage } from './analyzeFrame'
